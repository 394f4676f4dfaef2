import { encodeHello, encodeSampleNdjson, encodeSampleTsv, replaySample, type RecordedGazeRow } from '../../../core/gaze/feed';
import type { GazeHello } from '../../../core/gaze/gaze-sample';
import type { DeadlineTimer } from './deadline-timer';

export interface ReplayOptions {
  readonly hello: GazeHello;
  readonly send: (lines: readonly string[]) => Promise<void>;
  readonly timer: DeadlineTimer;
  /** 1 = the recorded rate, 2 = twice as fast. */
  readonly speed: number;
  readonly format: 'ndjson' | 'tsv';
  readonly onProgress?: (fraction: number) => void;
}

export interface ReplayResult {
  readonly samples: number;
  /** The latest any sample went out after its deadline, ms. */
  readonly maxLateMs: number;
}

/**
 * Sends recorded rows through a feed at their recorded spacing: row i goes at the absolute
 * deadline start + (t_i - t_0) / speed, so a late wake-up delays one sample and never the
 * ones after it (relative sleeps would add every delay up). Rows are numbered in file
 * order, so the receiver counts losses from sequence numbers.
 */
export async function replayGaze(rows: readonly RecordedGazeRow[], options: ReplayOptions): Promise<ReplayResult> {
  const { hello, send, timer, speed } = options;
  if (!(speed > 0 && Number.isFinite(speed))) throw new RangeError(`speed must be a number above 0, got ${speed}`);
  const header = { hello, tsvSeq: true };
  await send([encodeHello(hello, { tsvSeq: true })]);
  const startNs = timer.clock.nowNs();
  const t0 = rows[0]!.trackerTimeS;
  let maxLateNs = 0;
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i]!;
    const deadlineNs = startNs + ((row.trackerTimeS - t0) / speed) * 1e9;
    await timer.sleepUntilNs(deadlineNs);
    maxLateNs = Math.max(maxLateNs, timer.clock.nowNs() - deadlineNs);
    const sample = replaySample(row, i, hello);
    await send([options.format === 'tsv' ? encodeSampleTsv(sample, header) : encodeSampleNdjson(sample)]);
    if (i % 1000 === 0) options.onProgress?.(i / rows.length);
  }
  options.onProgress?.(1);
  return { samples: rows.length, maxLateMs: maxLateNs / 1e6 };
}
