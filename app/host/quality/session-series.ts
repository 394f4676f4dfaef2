import { combinedGaze } from '../../core/gaze/gaze-sample';
import { dataLossPct } from '../../core/quality/data-loss';
import { MESSAGE_KINDS } from '../../core/recording/message-kinds';
import { readSession } from '../recording/read-session';

/** The default width of the time bins, seconds. */
export const DEFAULT_BIN_S = 10;

export interface DataLossSeries {
  readonly binS: number;
  /** Per bin from the first sample: invalid or missing over expected samples, %. */
  readonly pct: number[];
  /** Per bin: samples expected at the nominal rate, and valid samples recorded. */
  readonly expected: number[];
  readonly valid: number[];
  /** Over the whole recording; null without samples. */
  readonly overallPct: number | null;
}

export interface LateFrameSeries {
  readonly binS: number;
  /** Per bin (the same bins as data loss): frames presented and how many of them were late. */
  readonly frames: number[];
  readonly late: number[];
  /** Every frame of the log, including those before the first gaze sample. */
  readonly totalFrames: number;
  readonly totalLate: number;
}

/** The gaze for plots: seconds from the first sample, screen px, NaN for invalid samples. */
export interface GazeSeries {
  readonly timeS: Float64Array;
  readonly x: Float32Array;
  readonly y: Float32Array;
}

export interface SessionSeries {
  readonly firstSampleHostNs: number | null;
  /** The tracker's nominal rate (its hello), else 1 / the median sample interval; null with fewer than two samples. */
  readonly rateHz: number | null;
  readonly samples: number;
  readonly dataLoss: DataLossSeries;
  readonly lateFrames: LateFrameSeries;
  readonly gaze: GazeSeries;
}

function medianInterval(sortedNs: Float64Array): number | null {
  const steps = new Float64Array(Math.max(0, sortedNs.length - 1));
  let n = 0;
  for (let i = 1; i < sortedNs.length; i++) if (sortedNs[i]! > sortedNs[i - 1]!) steps[n++] = sortedNs[i]! - sortedNs[i - 1]!;
  if (n === 0) return null;
  const s = steps.subarray(0, n).sort();
  return n % 2 === 1 ? s[(n - 1) / 2]! : (s[n / 2 - 1]! + s[n / 2]!) / 2;
}

/**
 * A recording's quality over time, read from its session folder (as on disk, without
 * recovery). Bins run from the first gaze sample's host time, `binS` wide, the last one
 * ending at the last sample. A bin expects its duration times the nominal rate (the last
 * bin's duration runs one sample interval past the last sample), so samples that never
 * arrived count as lost like invalid ones (Holmqvist, Nyström and Mulvey 2012, ETRA).
 * Without a rate, only invalid samples count (each bin expects what it received).
 */
export async function readSessionSeries(dir: string, options: { binS?: number } = {}): Promise<SessionSeries> {
  const binS = options.binS ?? DEFAULT_BIN_S;
  if (!(Number.isFinite(binS) && binS > 0)) throw new RangeError(`binS must be a number > 0, got ${binS}`);
  const reader = await readSession(dir);
  const hostNs: number[] = [];
  const xs: number[] = [];
  const ys: number[] = [];
  for await (const chunk of reader.chunks('gaze')) {
    for (const r of chunk.records) {
      const g = combinedGaze(r);
      const valid = g !== null && Number.isFinite(g.x) && Number.isFinite(g.y);
      hostNs.push(r.hostNs);
      xs.push(valid ? g.x : Number.NaN);
      ys.push(valid ? g.y : Number.NaN);
    }
  }
  let helloRate: number | null = null;
  for await (const m of reader.messages()) {
    const rate = m.data.rateHz;
    if (m.kind === MESSAGE_KINDS.trackerHello && typeof rate === 'number' && Number.isFinite(rate) && rate > 0) {
      helloRate = rate;
      break;
    }
  }

  const sorted = Float64Array.from(hostNs).sort();
  const first = sorted.length ? sorted[0]! : null;
  const last = sorted.length ? sorted[sorted.length - 1]! : null;
  const interval = medianInterval(sorted);
  const rateHz = helloRate ?? (interval === null ? null : 1e9 / interval);
  const binNs = binS * 1e9;
  const bins = first === null ? 0 : Math.floor((last! - first) / binNs) + 1;
  const valid = new Array<number>(bins).fill(0);
  const received = new Array<number>(bins).fill(0);
  hostNs.forEach((t, i) => {
    const b = Math.floor((t - first!) / binNs);
    received[b]!++;
    if (!Number.isNaN(xs[i])) valid[b]!++;
  });
  const spanS = first === null ? 0 : (last! - first) / 1e9 + (rateHz ? 1 / rateHz : 0);
  const expected = valid.map((_, b) => (rateHz ? Math.min(binS, spanS - b * binS) * rateHz : received[b]!));
  const pct = expected.map((e, b) => dataLossPct(valid[b]!, e));
  const totalExpected = expected.reduce((a, b) => a + b, 0);
  const totalValid = valid.reduce((a, b) => a + b, 0);
  const dataLoss = { binS, pct, expected, valid, overallPct: totalExpected > 0 ? dataLossPct(totalValid, totalExpected) : null };

  const frames = new Array<number>(bins).fill(0);
  const late = new Array<number>(bins).fill(0);
  let totalFrames = 0;
  let totalLate = 0;
  for await (const f of reader.frames()) {
    totalFrames++;
    if (f.late) totalLate++;
    if (first === null) continue;
    const b = Math.floor((f.hostNs - first) / binNs);
    if (b < 0 || b >= bins) continue;
    frames[b]!++;
    if (f.late) late[b]!++;
  }

  const gaze = {
    timeS: Float64Array.from(hostNs, (t) => (t - first!) / 1e9),
    x: Float32Array.from(xs),
    y: Float32Array.from(ys),
  };
  return { firstSampleHostNs: first, rateHz, samples: hostNs.length, dataLoss, lateFrames: { binS, frames, late, totalFrames, totalLate }, gaze };
}
