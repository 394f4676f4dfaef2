/**
 * One gaze sample as a tracker reports it, in the units its hello declared:
 *   screen_px    screen pixels, origin top-left, y down (what Gazeloom records)
 *   screen_norm  0..1 across the screen, converted to screen_px on arrival
 *   raw          the tracker's own coordinates, for trackers that rely on Gazeloom's calibration
 * Invalid samples (blinks, lost tracking) are sent and kept, never omitted: data loss is
 * measured from them.
 */
export type GazeUnits = 'screen_px' | 'screen_norm' | 'raw';

export interface EyeSample {
  readonly x: number;
  readonly y: number;
  readonly valid: boolean;
  /** Pupil size in the hello's pupil unit, or null when not sent. */
  readonly pupil: number | null;
}

export interface GazeSample {
  /** The sender's sequence number, when it sends one (lets the host count losses exactly). */
  readonly seq: number | null;
  /** The tracker's own timestamp, in seconds of the tracker's clock. */
  readonly trackerTimeS: number;
  readonly left: EyeSample | null;
  readonly right: EyeSample | null;
}

export type RecordedEyes = 'left' | 'right' | 'both';
export type PupilUnit = 'mm' | 'px' | 'arbitrary';

/** The first line a tracker sends on a gaze feed. */
export interface GazeHello {
  readonly protocol: 'gazeloom-feed';
  readonly version: 1;
  readonly units: GazeUnits;
  readonly rateHz: number;
  readonly eyes: RecordedEyes;
  /** The screen the tracker maps gaze onto, in pixels (required for screen_norm). */
  readonly screen: { readonly widthPx: number; readonly heightPx: number } | null;
  readonly pupilUnit: PupilUnit | null;
  /** Free text naming the tracker or bridge, for the session log. */
  readonly source: string | null;
}

/**
 * The eye position a sample stands for: the mean of the valid eyes (both valid), the one
 * valid eye, or null when neither is valid.
 */
export function combinedGaze(sample: GazeSample): { x: number; y: number } | null {
  const l = sample.left?.valid ? sample.left : null;
  const r = sample.right?.valid ? sample.right : null;
  if (l && r) return { x: (l.x + r.x) / 2, y: (l.y + r.y) / 2 };
  const one = l ?? r;
  return one ? { x: one.x, y: one.y } : null;
}
