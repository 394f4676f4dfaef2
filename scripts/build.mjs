// Builds everything `npm start`, the `gazeloom` command and the tests run: the Node-side
// bundles with esbuild and the renderer pages with Vite. Runs on `npm install` (prepare).
import { build as esbuild } from 'esbuild';
import { build as viteBuild } from 'vite';
import { rm } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const started = Date.now();

// CommonJS bundles (Electron main and preload) have no import.meta.url of their own.
const cjsImportMeta = {
  banner: { js: "const __import_meta_url = require('node:url').pathToFileURL(__filename).href;" },
  define: { 'import.meta.url': '__import_meta_url' },
};

const node = { bundle: true, platform: 'node', target: 'node20', sourcemap: true, logLevel: 'warning', absWorkingDir: root };

await rm(`${root}/dist`, { recursive: true, force: true });
await Promise.all([
  esbuild({ ...node, entryPoints: ['app/host/browser-mode/main.ts'], outfile: 'dist/host/browser-mode.mjs', format: 'esm', packages: 'external' }),
  esbuild({ ...node, entryPoints: ['app/cli/main.ts'], outfile: 'dist/cli/gazeloom.mjs', format: 'esm', packages: 'external' }),
  esbuild({ ...node, ...cjsImportMeta, entryPoints: ['app/main/main.ts'], outfile: 'dist/main/main.cjs', format: 'cjs', packages: 'external' }),
  // A sandboxed preload may only require('electron'): everything else is bundled into it.
  esbuild({ ...node, ...cjsImportMeta, entryPoints: ['app/preload/preload.ts'], outfile: 'dist/preload/preload.cjs', format: 'cjs', external: ['electron'] }),
]);
await viteBuild({ configFile: `${root}/vite.config.ts`, logLevel: 'warn' });
process.stdout.write(`gazeloom: built dist/ in ${((Date.now() - started) / 1000).toFixed(1)} s\n`);
