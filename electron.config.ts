import type { Configuration } from 'electron-builder';
import pkg from './package.json' with { type: 'json' };

/**
 * Packaging for `npm run dist` (electron-builder), on a machine that can fetch Electron.
 * Only the built bundles and the package manifest go into the app; sources, tests and
 * recordings never do.
 */
const config: Configuration = {
  appId: 'org.gazeloom.app',
  productName: 'Gazeloom',
  electronVersion: pkg.optionalDependencies.electron,
  directories: { output: 'release', buildResources: 'resources' },
  files: ['dist/**/*', '!dist/**/*.map', 'package.json'],
  extraMetadata: { main: 'dist/main/main.cjs' },
  asar: true,
  linux: { target: ['AppImage', 'deb'], category: 'Science', maintainer: 'Gazeloom maintainers' },
  win: { target: ['nsis'] },
  mac: { target: ['dmg'], category: 'public.app-category.education' },
  nsis: { oneClick: false, allowToChangeInstallationDirectory: true },
};

export default config;
