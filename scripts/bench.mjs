// `npm run bench`: runs every test/bench/*.bench.ts, writes bench/results.json and prints a
// table. Each benchmark measures its peer in the same run, so ratios compare like with like.
import { build } from 'esbuild';
import { mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const only = process.argv[2];
const files = readdirSync(`${root}/test/bench`).filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only))).sort();
const outdir = `${root}/node_modules/.cache/gazeloom-bench`;
await build({
  entryPoints: files.map((f) => `${root}/test/bench/${f}`),
  outdir,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  outExtension: { '.js': '.mjs' },
  logLevel: 'warning',
});

const results = [];
for (const file of files) {
  const { benchmark } = await import(pathToFileURL(`${outdir}/${file.replace(/\.ts$/, '.mjs')}`).href);
  process.stdout.write(`\n# ${benchmark.name}\n`);
  try {
    results.push(...(await benchmark.run((line) => process.stdout.write(`  ${line}\n`))));
  } catch (error) {
    process.stdout.write(`  FAILED: ${error.stack ?? error}\n`);
    process.exitCode = 1;
  }
}

mkdirSync(`${root}/bench`, { recursive: true });
writeFileSync(`${root}/bench/results.json`, `${JSON.stringify(results, null, 2)}\n`);

const fmt = (n) => (n === null ? '-' : Math.abs(n) >= 1000 ? n.toExponential(3) : n.toPrecision(4));
const rows = results.map((r) => [r.name, `${fmt(r.value)} ${r.unit}`, r.peer ?? '-', r.peer_value === null ? '-' : `${fmt(r.peer_value)}`, r.ratio === null ? '-' : `${r.ratio.toFixed(2)}x`]);
const header = ['benchmark', 'value', 'peer', 'peer value', 'ratio'];
const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
const line = (cells) => cells.map((c, i) => c.padEnd(widths[i])).join('  ');
process.stdout.write(`\n${line(header)}\n${widths.map((w) => '-'.repeat(w)).join('  ')}\n${rows.map(line).join('\n')}\n\nwrote bench/results.json\n`);
// Benchmarks may leave sockets or workers behind on failure; the run is over either way.
process.exit(process.exitCode ?? 0);
