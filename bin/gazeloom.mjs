#!/usr/bin/env node
// The `gazeloom` command. The TypeScript sources are bundled into dist/ by `npm install`
// (the prepare script) or `npm run build`.
import { existsSync } from 'node:fs';

const bundle = new URL('../dist/cli/gazeloom.mjs', import.meta.url);
if (!existsSync(bundle)) {
  process.stderr.write('gazeloom: dist/cli/gazeloom.mjs is missing; run `npm run build` in the Gazeloom checkout\n');
  process.exit(2);
}
await import(bundle.href);
