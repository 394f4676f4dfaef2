// The gaze feed soak: the ingest benchmark (test/bench/feed-ingest.bench.ts) run for 10
// minutes by default. A tracker bridge in another process sends 2000 Hz over UDP on
// 127.0.0.1; prints what arrived and exits with status 1 if any sample was lost.
//   node scripts/soak-feed.mjs [--seconds 600] [--rate 2000]
import { build } from 'esbuild';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';

const { values } = parseArgs({ options: { seconds: { type: 'string', default: '600' }, rate: { type: 'string', default: '2000' } } });
const seconds = Number(values.seconds);
const rateHz = Number(values.rate);
if (!(seconds > 0) || !(rateHz > 0)) {
  process.stderr.write('soak-feed: --seconds and --rate must be numbers above 0\n');
  process.exit(2);
}

const root = fileURLToPath(new URL('..', import.meta.url));
const outfile = `${root}/node_modules/.cache/gazeloom-bench/soak-feed.mjs`;
await build({ entryPoints: [`${root}/test/bench/feed-ingest.bench.ts`], outfile, bundle: true, platform: 'node', format: 'esm', target: 'node20', packages: 'external', logLevel: 'warning' });
const { runFeedIngest } = await import(pathToFileURL(outfile).href);

process.stdout.write(`soak-feed: ${rateHz} Hz for ${seconds} s over UDP on 127.0.0.1...\n`);
const { ours: result } = await runFeedIngest({ seconds, rateHz, withPeer: false });
process.stdout.write(`${JSON.stringify({ rate_hz: rateHz, seconds, expected: Math.round(rateHz * seconds), ...result }, null, 2)}\n`);
process.exit(result.lost === 0 && result.garbageLines === 0 ? 0 : 1);
