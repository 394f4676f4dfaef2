import type { EyeSample } from '../gaze/gaze-sample';

/**
 * What a session recording holds, one record type per stream. Host times are nanoseconds
 * on the host's monotonic clock counted from the host's start (HostNs), as numbers.
 */

/** A gaze sample as recorded: the tracker's own time, when it arrived, and the host time it maps to. */
export interface GazeRecord {
  readonly seq: number | null;
  readonly trackerTimeS: number;
  readonly arrivalNs: number;
  /** The tracker time mapped to host time with the clock fit current at arrival. */
  readonly hostNs: number;
  readonly left: EyeSample | null;
  readonly right: EyeSample | null;
}

/** One frame the stage presented. */
export interface FrameRecord {
  readonly frame: number;
  /** The stage's own clock (the animation-frame timestamp, ms). */
  readonly stageTimeMs: number;
  /** The same instant in host time, through the stage clock sync. */
  readonly hostNs: number;
  /** The clip shown, and its stimulus time in µs on the clip's own axis; null between clips. */
  readonly clip: string | null;
  readonly stimulusUs: number | null;
  readonly eventsDrawn: number;
  /** The interval since the previous frame exceeded 1.5 nominal refresh intervals. */
  readonly late: boolean;
  /** The photodiode patch's state in this frame (0 black, 1 white), or null when the patch is off. */
  readonly photodiode: 0 | 1 | null;
}

/**
 * Everything else that happened, in host time: clip onsets and offsets (with the clip's
 * placement and speed), targets shown and removed, tracker hello, gaps in the gaze feed,
 * clock-fit updates, operator marks and notes, blanks.
 */
export interface MessageRecord {
  readonly hostNs: number;
  readonly kind: string;
  readonly data: Readonly<Record<string, unknown>>;
}
