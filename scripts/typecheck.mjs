// Type-checks each layer with its own configuration. app/core is checked with no Node and
// no DOM types, so a stray `fs` or `window` fails here. The Electron shell is checked when
// the electron package (its type declarations) is installed, as it is in CI.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const tsc = `${root}/node_modules/typescript/bin/tsc`;
const projects = ['tsconfig.core.json', 'tsconfig.node.json', 'tsconfig.renderer.json', 'tsconfig.test.json'];
if (existsSync(`${root}/node_modules/electron/electron.d.ts`)) projects.push('tsconfig.electron.json');
else process.stdout.write('typecheck: electron is not installed; skipping tsconfig.electron.json\n');

let failed = false;
for (const project of projects) {
  const result = spawnSync(process.execPath, [tsc, '-p', project], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) {
    failed = true;
    process.stderr.write(`typecheck: ${project} failed\n`);
  }
}
process.exit(failed ? 1 : 0);
