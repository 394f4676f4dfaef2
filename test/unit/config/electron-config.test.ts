import { describe, expect, it } from 'vitest';
import config from '../../../electron.config';
import pkg from '../../../package.json' with { type: 'json' };

const targetNames = (target: unknown): string[] =>
  (Array.isArray(target) ? target : [target]).map((t) => (typeof t === 'string' ? t : (t as { target: string }).target));

describe('electron-builder configuration', () => {
  it('names the product and pins the Electron version to the installed dependency', () => {
    expect(config.appId).toBe('org.gazeloom.app');
    expect(config.productName).toBe('Gazeloom');
    expect(config.electronVersion).toBe(pkg.optionalDependencies.electron);
    expect(config.electronVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('builds AppImage and deb on Linux, NSIS on Windows and dmg on macOS', () => {
    expect(targetNames(config.linux?.target)).toEqual(['AppImage', 'deb']);
    expect(targetNames(config.win?.target)).toEqual(['nsis']);
    expect(targetNames(config.mac?.target)).toEqual(['dmg']);
  });

  it('packages only the built bundles and the manifest, with the main entry the bundle', () => {
    expect(config.files).toEqual(['dist/**/*', '!dist/**/*.map', 'package.json']);
    expect((config.extraMetadata as { main: string }).main).toBe(pkg.main);
    expect(pkg.main).toBe('dist/main/main.cjs');
  });

  it('keeps Electron optional so installs without its binary still succeed', () => {
    expect(pkg.optionalDependencies).toHaveProperty('electron');
    expect(pkg.dependencies).not.toHaveProperty('electron');
    expect(pkg.devDependencies).not.toHaveProperty('electron');
  });
});
