import { decimateToColumns } from '../../renderer/console/plots/decimate';
import { buildDrawPath, seriesExtent } from '../../renderer/console/plots/draw-path';
import { Xoshiro128 } from '../../app/core/random/xoshiro128';
import { duration, type Benchmark } from './harness';

// A whole session at 1000 Hz: one hour, 3.6 million gaze samples, about 1 % of them
// missing in short runs (blinks), drawn into a plot 1200 px wide as the quality screen does.
const SAMPLES = 3_600_000;
const RATE_HZ = 1000;
const COLUMNS = 1200;
const HEIGHT_PX = 180;
const WARM_UP = 5;
const MEASURED = 40;

function session(): { xs: Float64Array; ys: Float64Array } {
  const random = new Xoshiro128(6);
  const xs = new Float64Array(SAMPLES);
  const ys = new Float64Array(SAMPLES);
  let y = 960;
  let blink = 0;
  for (let i = 0; i < SAMPLES; i++) {
    xs[i] = i / RATE_HZ;
    if (blink === 0 && random.nextInt(10_000) < 1) blink = 100;
    if (random.nextInt(500) === 0) y = 200 + random.nextInt(1520); // a saccade
    ys[i] = blink > 0 ? Number.NaN : y + (random.nextInt(21) - 10) * 0.3;
    if (blink > 0) blink--;
  }
  return { xs, ys };
}

function timeRuns(run: () => void): number {
  const times: number[] = [];
  for (let r = 0; r < WARM_UP + MEASURED; r++) {
    const start = process.hrtime.bigint();
    run();
    const elapsed = Number(process.hrtime.bigint() - start) / 1e6;
    if (r >= WARM_UP) times.push(elapsed);
  }
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)]!;
}

export const benchmark: Benchmark = {
  name: 'quality plot: extent, min/max decimation and draw path of a 3.6-million-point series',
  async run(log) {
    const { xs, ys } = session();
    let sink = 0;
    // Peer: a plain copy of the same two arrays, the memory traffic any full pass costs.
    const copy = timeRuns(() => {
      sink += xs.slice()[SAMPLES - 1]! + ys.slice()[0]!;
    });
    const draw = timeRuns(() => {
      const extent = seriesExtent([{ xs, ys }])!;
      const cols = decimateToColumns(xs, ys, extent.x0, extent.x1, COLUMNS);
      const span = extent.y1 - extent.y0 || 1;
      const path = buildDrawPath(cols, 0, (y) => HEIGHT_PX - ((y - extent.y0) / span) * HEIGHT_PX);
      sink += path.vertices;
    });
    log(`3.6 M points: extent + decimate + path p50 ${draw.toFixed(2)} ms; copy of xs and ys p50 ${copy.toFixed(2)} ms (${sink > 0 ? 'ok' : ''})`);
    return [duration('quality plot draw path, 3.6 M points into 1200 columns, p50', draw, 'ms', { name: 'plain copy of the same xs and ys arrays, p50', value: copy })];
  },
};
