import type { Placement } from '../../core/geometry/placement';
import { clipStartPlacement, MESSAGE_KINDS, type RecordingOpenData } from '../../core/recording/message-kinds';
import { sessionClock, type SegmentOpen, type SessionClock } from '../../core/recording/session-clock';
import type { SessionReader } from './read-session';

export interface PlacedClip {
  readonly timeS: number;
  readonly placement: Placement;
}

/** What the message log says about time and stimuli, on the session clock. */
export interface SessionTimeline {
  readonly clock: SessionClock;
  /** Session times where the tracker clock may have restarted: each hello, each new segment. */
  readonly runStartsS: readonly number[];
  /** Every clip_start, per clip, in time order. */
  readonly clipStarts: ReadonlyMap<string, readonly PlacedClip[]>;
  readonly warnings: readonly string[];
}

const isOpenData = (d: Record<string, unknown>): boolean =>
  typeof d.segment === 'number' && typeof d.wallTime === 'string' && (d.clockOriginNs === null || typeof d.clockOriginNs === 'string') && typeof d.firstChunks === 'object' && d.firstChunks !== null;

export async function readSessionTimeline(reader: SessionReader): Promise<SessionTimeline> {
  const messages: { seq: number; hostNs: number; kind: string; data: Record<string, unknown> }[] = [];
  for await (const chunk of reader.chunks('messages')) for (const m of chunk.records) messages.push({ seq: chunk.seq, ...m, data: m.data as Record<string, unknown> });
  const opens: SegmentOpen[] = messages.filter((m) => m.kind === MESSAGE_KINDS.recordingOpen && isOpenData(m.data)).map((m) => ({ hostNs: m.hostNs, data: m.data as unknown as RecordingOpenData }));
  const clock = sessionClock(reader.info.createdHostNs, opens);
  const warnings = [...clock.warnings];
  const at = (m: (typeof messages)[number]) => clock.toSessionS(clock.segmentOf('messages', m.seq), m.hostNs);

  const runStartsS = [
    ...messages.filter((m) => m.kind === MESSAGE_KINDS.trackerHello).map(at),
    ...opens.filter((o) => o.data.segment > 0).map((o) => clock.toSessionS(o.data.segment, o.hostNs)),
  ];
  const clipStarts = new Map<string, PlacedClip[]>();
  for (const m of messages.filter((m) => m.kind === MESSAGE_KINDS.clipStart)) {
    const placed = clipStartPlacement(m);
    if (typeof placed === 'string') {
      warnings.push(placed);
      continue;
    }
    const list = clipStarts.get(placed.clip) ?? [];
    list.push({ timeS: at(m), placement: placed.placement });
    clipStarts.set(placed.clip, list);
  }
  for (const list of clipStarts.values()) list.sort((a, b) => a.timeS - b.timeS);
  return { clock, runStartsS, clipStarts, warnings };
}

/** The placement of the latest clip_start of `clip` at or before `timeS`, or null. */
export function placementAt(timeline: SessionTimeline, clip: string, timeS: number): Placement | null {
  const list = timeline.clipStarts.get(clip);
  let found: Placement | null = null;
  for (const entry of list ?? []) {
    if (entry.timeS > timeS) break;
    found = entry.placement;
  }
  return found;
}
