import type { RecordStream } from './chunk-format';
import type { RecordingOpenData } from './message-kinds';

/**
 * The session clock: seconds from the moment the session was created, on the host clock
 * of that first opening. Records carry host times of the host process that wrote them,
 * and a host that crashed and resumed the session starts a new clock (a new segment).
 * Segment k's times are shifted onto segment 0's clock:
 *   by the difference of the clocks' origins on the machine's monotonic clock, exact, when
 *   both are known and agree with the wall clock to within ORIGIN_AGREEMENT_S (they cannot
 *   after a reboot, when the monotonic clock restarts);
 *   otherwise by the wall-clock times of the two openings, to the wall clock's accuracy.
 */
export interface SegmentOpen {
  readonly hostNs: number;
  readonly data: RecordingOpenData;
}

export interface SessionClock {
  /** The segment whose chunks include `chunkSeq` of `stream`. */
  segmentOf(stream: RecordStream, chunkSeq: number): number;
  /** A host time of `segment` as seconds on the session clock. */
  toSessionS(segment: number, hostNs: number): number;
  readonly segments: number;
  readonly warnings: readonly string[];
}

export const ORIGIN_AGREEMENT_S = 5;

export function sessionClock(createdHostNs: number, opens: readonly SegmentOpen[]): SessionClock {
  const sorted = [...opens].sort((a, b) => a.data.segment - b.data.segment);
  const warnings: string[] = [];
  const first = sorted[0];
  const shifts = new Map<number, number>([[0, 0]]);
  if (first && first.data.segment !== 0) warnings.push(`the opening of segment 0 is missing from the messages; segment ${first.data.segment} is taken as the first`);
  for (const open of sorted.slice(1)) {
    const f = first!;
    const byWall = f.hostNs + (Date.parse(open.data.wallTime) - Date.parse(f.data.wallTime)) * 1e6 - open.hostNs;
    let shift = byWall;
    if (open.data.clockOriginNs !== null && f.data.clockOriginNs !== null) {
      const byOrigin = Number(BigInt(open.data.clockOriginNs) - BigInt(f.data.clockOriginNs));
      if (Math.abs(byOrigin - byWall) <= ORIGIN_AGREEMENT_S * 1e9) shift = byOrigin;
      else warnings.push(`segment ${open.data.segment}: its host clock restarted with the computer; aligned to the first by wall-clock time`);
    } else {
      warnings.push(`segment ${open.data.segment}: host clock origin unknown; aligned to the first by wall-clock time`);
    }
    shifts.set(open.data.segment, shift);
  }
  const segmentIds = sorted.length > 0 ? sorted.map((o) => o.data.segment) : [0];
  return {
    segments: segmentIds.length,
    warnings,
    segmentOf(stream, chunkSeq) {
      let found = segmentIds[0]!;
      for (const open of sorted) if (open.data.firstChunks[stream] <= chunkSeq) found = open.data.segment;
      return found;
    },
    toSessionS(segment, hostNs) {
      return (hostNs + (shifts.get(segment) ?? 0) - createdHostNs) / 1e9;
    },
  };
}
