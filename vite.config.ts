import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

const page = (name: string): string => fileURLToPath(new URL(`./renderer/${name}/index.html`, import.meta.url));

// Two pages, one build: the operator console and the stage. Absolute asset paths work both
// under the browser-mode server and under Electron's app:// protocol.
export default defineConfig({
  root: fileURLToPath(new URL('./renderer', import.meta.url)),
  base: '/',
  publicDir: false,
  oxc: { jsx: { runtime: 'automatic' } },
  build: {
    outDir: fileURLToPath(new URL('./dist/renderer', import.meta.url)),
    emptyOutDir: true,
    sourcemap: true,
    target: 'es2022',
    rolldownOptions: { input: { console: page('console'), stage: page('stage') } },
  },
});
