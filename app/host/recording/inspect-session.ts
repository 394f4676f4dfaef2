import { RECORD_STREAMS } from '../../core/recording/chunk-format';
import { GapFinder, type Gap } from '../../core/recording/gap-finder';
import { MESSAGE_KINDS } from '../../core/recording/message-kinds';
import type { MessageRecord } from '../../core/recording/records';
import { validClosedMarker } from './closed-marker';
import { readSession } from './read-session';
import { liveRecorder } from './recorder-lock';
import { examineSession, type RecoveryReport } from './recover-session';
import { STREAM_FILES } from './session-files';

export interface SessionInspection {
  /** Every gaze sample recorded, valid or not. */
  readonly samples: number;
  /** Tracker times of the first and last samples (in recorded order), seconds; null without samples. */
  readonly firstTimestampS: number | null;
  readonly lastTimestampS: number | null;
  readonly gaps: readonly Gap[];
  readonly corruptChunks: number;
  /** Bytes cut from torn tails over the session's life: by this inspection's recovery and earlier ones. */
  readonly tornTailBytes: number;
  /** Whether the session had been closed cleanly before this inspection. */
  readonly cleanClose: boolean;
  readonly warnings: readonly string[];
  readonly recovery: RecoveryReport;
}

const rateOf = (hello: MessageRecord | undefined): number | null => {
  const rate = hello?.data.rateHz;
  return typeof rate === 'number' && rate > 0 ? rate : null;
};

function describeDamage(recovery: RecoveryReport, live: boolean): string[] {
  const lines: string[] = [];
  for (const stream of RECORD_STREAMS) {
    const e = recovery.streams[stream];
    for (const c of e.corrupt) lines.push(`${STREAM_FILES[stream]}: ${c.bytes} damaged bytes at byte ${c.offset} (${c.chunks} chunk${c.chunks === 1 ? '' : 's'} lost): ${c.reason}`);
    // A live recorder's last chunk may simply be mid-write.
    if (e.tornTail && !live) lines.push(`${STREAM_FILES[stream]}: ${e.cut ? 'cut' : 'found'} a torn tail of ${e.tornTail.bytes} bytes at byte ${e.tornTail.offset}: ${e.tornTail.reason}`);
  }
  if (recovery.earlierTornTailBytes > 0) lines.push(`earlier recoveries cut ${recovery.earlierTornTailBytes} bytes of torn tails (recovery.ndjson)`);
  return lines;
}

/**
 * What `recording inspect` reports. A session that was not closed cleanly is recovered
 * first (its torn tail cut); a closed one is only read. A session still being recorded by
 * a live process is read as far as it is on disk, never cut.
 */
export async function inspectSession(dir: string): Promise<SessionInspection> {
  const cleanClose = (await validClosedMarker(dir)) !== null;
  const live = await liveRecorder(dir);
  const recovery = await examineSession(dir, { repair: !cleanClose && live === null });
  const warnings = describeDamage(recovery, live !== null);
  if (live) warnings.push(`process ${live.pid} is still recording into this session: read as far as it is on disk`);

  const reader = await readSession(dir);
  const messages: MessageRecord[] = [];
  for await (const m of reader.messages()) messages.push(m);
  const finder = new GapFinder(rateOf(messages.find((m) => m.kind === MESSAGE_KINDS.trackerHello)));
  for (const m of messages) {
    if (m.kind === MESSAGE_KINDS.gapStart) finder.gapStart(typeof m.data.lastTrackerTimeS === 'number' ? m.data.lastTrackerTimeS : null);
    if (m.kind === MESSAGE_KINDS.gapEnd && typeof m.data.firstTrackerTimeS === 'number') finder.gapEnd(m.data.firstTrackerTimeS);
  }
  let samples = 0;
  let firstTimestampS: number | null = null;
  let lastTimestampS: number | null = null;
  for await (const g of reader.gaze()) {
    samples++;
    firstTimestampS ??= g.trackerTimeS;
    lastTimestampS = g.trackerTimeS;
    finder.sample(g.seq, g.trackerTimeS);
  }
  return {
    samples,
    firstTimestampS,
    lastTimestampS,
    gaps: finder.finish(),
    corruptChunks: recovery.corruptChunks,
    tornTailBytes: (live ? 0 : recovery.tornTailBytes) + recovery.earlierTornTailBytes,
    cleanClose,
    warnings,
    recovery,
  };
}
