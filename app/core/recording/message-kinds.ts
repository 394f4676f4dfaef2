import type { DisplayGeometry } from '../geometry/display-geometry';
import type { Placement } from '../geometry/placement';
import type { RecordStream } from './chunk-format';
import type { MessageRecord } from './records';

/**
 * The message kinds the recorder writes or reads back, and the shape of their data. Other
 * kinds (targets, operator marks, clock-fit updates) are stored as given.
 *   recording_open      written by the recorder each time it creates or reopens the session
 *   tracker_hello       a source's hello, with the peer it came from
 *   tracker_connection  a source connected or disconnected
 *   gap_start, gap_end  a stretch without gaze: from a disconnection to the first sample after it
 *   clip_start          a clip began on the stage, with its speed and placement
 *   clock_fit           the live tracker clock fit (a TrackerClockMapping) as it went
 */
export const MESSAGE_KINDS = {
  recordingOpen: 'recording_open',
  trackerHello: 'tracker_hello',
  trackerConnection: 'tracker_connection',
  gapStart: 'gap_start',
  gapEnd: 'gap_end',
  clipStart: 'clip_start',
  clockFit: 'clock_fit',
} as const;

export interface RecordingOpenData {
  /** 0 at creation, then one more at every reopening. */
  readonly segment: number;
  /** Wall-clock time of the opening (ISO 8601), for aligning host clocks that restarted. */
  readonly wallTime: string;
  /** The host clock's zero on the machine's monotonic clock (ns, as a decimal string), when known. */
  readonly clockOriginNs: string | null;
  /** The sequence number of the first chunk this opening writes, per stream. */
  readonly firstChunks: Readonly<Record<RecordStream, number>>;
}

export interface GapStartData {
  readonly peer: string;
  readonly reason: string;
  /** Tracker time of the last sample before the gap, or null when none had arrived. */
  readonly lastTrackerTimeS: number | null;
}

export interface GapEndData {
  readonly peer: string;
  /** Tracker time of the first sample after the gap. */
  readonly firstTrackerTimeS: number;
}

export interface ClipStartData {
  readonly clip: string;
  readonly speed: number;
  readonly placement: Placement;
  readonly display: DisplayGeometry;
}

const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null;

/** The placement of a clip_start message, or the reason it has none usable. */
export function clipStartPlacement(message: MessageRecord): { clip: string; placement: Placement } | string {
  const { clip, placement } = message.data as Record<string, unknown>;
  if (typeof clip !== 'string') return 'clip_start message without a "clip" name';
  if (!isObject(placement) || !isNumber(placement.scale) || !(placement.scale > 0) || !isNumber(placement.left) || !isNumber(placement.top)) {
    return `clip_start of "${clip}": placement needs a positive "scale", "left" and "top"`;
  }
  const sensor = placement.sensor;
  if (!isObject(sensor) || !isNumber(sensor.width) || !isNumber(sensor.height)) return `clip_start of "${clip}": placement.sensor needs "width" and "height"`;
  const mode = placement.mode === '1:1' || placement.mode === 'integer' ? placement.mode : 'fit';
  return { clip, placement: { mode, scale: placement.scale, left: placement.left, top: placement.top, sensor: { width: sensor.width, height: sensor.height } } };
}
