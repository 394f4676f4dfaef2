import { combinedGaze } from '../gaze/gaze-sample';
import type { EyeSample } from '../gaze/gaze-sample';
import { onSensor, screenToSensor, type Placement } from '../geometry/placement';
import { screenPoint } from '../geometry/units';
import type { GazeRecord } from './records';

/**
 * The gaze TSV that `recording export` writes and analysis (and `feed replay`) reads:
 * one header row, then one row per sample, tab-separated, "n/a" where there is no value.
 * Column names follow the BIDS eye-tracking specification (BEP020: timestamp,
 * x_coordinate, y_coordinate, pupil_size); the rest are Gazeloom's own.
 *   timestamp          mapped host time, seconds on the session clock, 6 decimals
 *   x_coordinate, y_coordinate   screen px: the mean of the valid eyes, or the one valid eye
 *   pupil_size         the mean pupil of the valid eyes that report one, in the hello's unit
 *   tracker_timestamp  the tracker's own time in seconds, exactly as received
 * with --stimulus:
 *   clip               the clip on screen at the sample's time (tabs and line breaks as spaces)
 *   stimulus_time_us   the stimulus time that frame showed, µs on the clip's own time axis
 *   sensor_x, sensor_y the gaze on the clip's sensor pixels (pixel centres on integers);
 *                      n/a outside the sensor image
 */
export const GAZE_COLUMNS = ['timestamp', 'x_coordinate', 'y_coordinate', 'pupil_size', 'tracker_timestamp'] as const;
export const STIMULUS_COLUMNS = ['clip', 'stimulus_time_us', 'sensor_x', 'sensor_y'] as const;
export const NA = 'n/a';

/** Rounded to `digits` decimals, without trailing zeros ("12.5", "3", never "-0"). */
export function decimal(value: number, digits: number): string {
  const text = value.toFixed(digits);
  const trimmed = text.includes('.') ? text.replace(/\.?0+$/, '') : text;
  return trimmed === '-0' ? '0' : trimmed;
}

function meanPupil(eyes: readonly (EyeSample | null)[]): number | null {
  const pupils = eyes.filter((e): e is EyeSample => e !== null && e.valid && e.pupil !== null).map((e) => e.pupil!);
  return pupils.length === 0 ? null : pupils.reduce((a, b) => a + b, 0) / pupils.length;
}

export function gazeCells(record: GazeRecord, timestampS: number): string[] {
  const gaze = combinedGaze(record);
  const pupil = meanPupil([record.left, record.right]);
  return [
    decimal(timestampS, 6),
    gaze ? decimal(gaze.x, 4) : NA,
    gaze ? decimal(gaze.y, 4) : NA,
    pupil === null ? NA : decimal(pupil, 4),
    String(record.trackerTimeS),
  ];
}

export interface StimulusOnScreen {
  readonly clip: string;
  readonly stimulusUs: number | null;
  readonly placement: Placement | null;
}

export function stimulusCells(record: GazeRecord, shown: StimulusOnScreen | null): string[] {
  if (!shown) return [NA, NA, NA, NA];
  const gaze = combinedGaze(record);
  const sensor = gaze && shown.placement ? screenToSensor(shown.placement, screenPoint(gaze.x, gaze.y)) : null;
  const inside = sensor !== null && shown.placement !== null && onSensor(shown.placement, sensor);
  return [
    shown.clip.replace(/[\t\r\n]/g, ' '),
    shown.stimulusUs === null ? NA : decimal(shown.stimulusUs, 3),
    inside ? decimal(sensor.x, 3) : NA,
    inside ? decimal(sensor.y, 3) : NA,
  ];
}
