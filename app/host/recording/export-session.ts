import { RECORD_STREAMS } from '../../core/recording/chunk-format';
import { GAZE_COLUMNS, gazeCells, STIMULUS_COLUMNS, stimulusCells, type StimulusOnScreen } from '../../core/recording/export-row';
import { FrameTimeline, type TimelineFrame } from '../../core/recording/frame-timeline';
import type { GazeRecord } from '../../core/recording/records';
import { TrackerRuns, type RunFit } from '../../core/recording/tracker-runs';
import { validClosedMarker } from './closed-marker';
import { readSession, type SessionReader } from './read-session';
import { examineSession } from './recover-session';
import { STREAM_FILES } from './session-files';
import { placementAt, readSessionTimeline, type SessionTimeline } from './session-timeline';
import { writeTextDurably } from './write-text-durably';

export interface ExportOptions {
  /** Add clip, stimulus time and sensor coordinates from the frame log and clip_start placements. */
  readonly stimulus: boolean;
  readonly onProgress?: (fraction: number) => void;
}

export interface ExportSummary {
  readonly samples: number;
  /** Samples that fell on a clip's frame (with --stimulus). */
  readonly inClip: number;
  /** One batch clock fit per tracker run. */
  readonly runs: readonly RunFit[];
  readonly warnings: readonly string[];
}

async function frameTimeline(reader: SessionReader, timeline: SessionTimeline): Promise<FrameTimeline> {
  const frames: TimelineFrame[] = [];
  for await (const chunk of reader.chunks('frames')) {
    const segment = timeline.clock.segmentOf('frames', chunk.seq);
    for (const f of chunk.records) frames.push({ timeS: timeline.clock.toSessionS(segment, f.hostNs), clip: f.clip, stimulusUs: f.stimulusUs });
  }
  return new FrameTimeline(frames);
}

/** Every gaze sample with its arrival on the session clock. */
async function* gazeOnSessionClock(reader: SessionReader, timeline: SessionTimeline): AsyncGenerator<{ record: GazeRecord; arrivalS: number }> {
  for await (const chunk of reader.chunks('gaze')) {
    const segment = timeline.clock.segmentOf('gaze', chunk.seq);
    for (const record of chunk.records) yield { record, arrivalS: timeline.clock.toSessionS(segment, record.arrivalNs) };
  }
}

/**
 * Writes a session's gaze as the TSV of export-row.ts. The timestamp column is each
 * sample's tracker time mapped to the session clock by the batch fit of its tracker run
 * (TrackerRuns), not the live-mapped GazeRecord.hostNs: the batch fit uses the whole run,
 * both sides of each sample, where the live fit had only what came before (early samples
 * had no skew fit at all). The session clock's zero is the session's creation
 * (session.json createdHostNs), the same clock the messages and frames are placed on.
 * The session is read as it is on disk, without recovery.
 */
export async function exportSession(dir: string, out: string, options: ExportOptions): Promise<ExportSummary> {
  const reader = await readSession(dir);
  const check = await examineSession(dir, { repair: false });
  const timeline = await readSessionTimeline(reader);
  const warnings = [...timeline.warnings];
  if ((await validClosedMarker(dir)) === null) warnings.push('the session was not closed cleanly: exported as far as it is on disk (run recording inspect to recover it)');
  for (const stream of RECORD_STREAMS) {
    const e = check.streams[stream];
    if (e.corruptChunks > 0) warnings.push(`${STREAM_FILES[stream]}: ${e.corruptChunks} damaged chunk(s) skipped`);
  }

  const runs = new TrackerRuns(timeline.runStartsS);
  for await (const { record, arrivalS } of gazeOnSessionClock(reader, timeline)) runs.add(record.trackerTimeS, arrivalS);
  const fits = runs.fit().filter((f): f is RunFit => f !== null);
  fits.forEach((f, i) => f.mapping.skewFitted || warnings.push(`tracker run ${i + 1} (${f.samples} samples) is too short to fit the clock skew; mapped by offset only`));
  const samples = fits.reduce((n, f) => n + f.samples, 0);
  if (samples === 0) warnings.push('the session holds no gaze samples: the file has only its header row');

  const frames = options.stimulus ? await frameTimeline(reader, timeline) : null;
  const unplaced = new Set<string>();
  let inClip = 0;
  let written = 0;
  async function* rows(): AsyncGenerator<string> {
    yield `${[...GAZE_COLUMNS, ...(frames ? STIMULUS_COLUMNS : [])].join('\t')}\n`;
    for await (const { record, arrivalS } of gazeOnSessionClock(reader, timeline)) {
      const timeS = runs.toSessionS(record.trackerTimeS, arrivalS);
      const cells = gazeCells(record, timeS);
      if (frames) {
        const frame = frames.at(timeS);
        let shown: StimulusOnScreen | null = null;
        if (frame?.clip) {
          const placement = placementAt(timeline, frame.clip, timeS);
          if (!placement) unplaced.add(frame.clip);
          shown = { clip: frame.clip, stimulusUs: frame.stimulusUs, placement };
          inClip++;
        }
        cells.push(...stimulusCells(record, shown));
      }
      yield `${cells.join('\t')}\n`;
      if (++written % 65536 === 0) options.onProgress?.(written / samples);
    }
    options.onProgress?.(1);
  }
  await writeTextDurably(out, rows());
  for (const clip of unplaced) warnings.push(`clip "${clip}" has frames but no clip_start message with its placement: sensor_x and sensor_y are n/a`);
  return { samples, inClip, runs: fits, warnings };
}
