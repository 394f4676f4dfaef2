import { rawCalibrationParams, type RawCalibrationParams } from '../../core/quality/correction/raw-calibration';
import { readSession } from '../recording/read-session';

export const GAZE_CALIBRATION_MESSAGE = 'gaze_calibration_set';

/**
 * The raw-coordinate calibration in force at the end of a recording: the params of its last
 * gaze_calibration_set message, or null when there is none, the last one cleared the
 * mapping, or its params no longer read as a calibration. A resumed recording maps its
 * samples with it again, as the session did before it was interrupted.
 */
export async function lastGazeCalibration(dir: string): Promise<RawCalibrationParams | null> {
  const reader = await readSession(dir);
  let last: unknown = null;
  for await (const message of reader.messages()) if (message.kind === GAZE_CALIBRATION_MESSAGE) last = message.data.params ?? null;
  const parsed = rawCalibrationParams.safeParse(last);
  return parsed.success ? parsed.data : null;
}
