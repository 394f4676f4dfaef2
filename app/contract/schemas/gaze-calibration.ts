import { z } from 'zod';
import { rawCalibrationParams } from '../../core/quality/correction/raw-calibration';

/**
 * Gazeloom's own calibration of a tracker that sends raw coordinates: from now on the host
 * maps every sample of the running recording from raw coordinates to screen px with these
 * params (fitRawCalibration), or stops mapping with null. Each change is recorded in the
 * session as a gaze_calibration_set message, with the calibrations record it came from.
 */
export const setGazeCalibrationRequest = z
  .object({
    params: rawCalibrationParams.nullable(),
    /** The console's calibrations record the params were fitted for (provenance). */
    calibrationId: z.string().min(1).max(120).nullable(),
  })
  .strict();

export const setGazeCalibrationResponse = z.object({
  /** The units the source's hello declared (null before its hello). */
  sourceUnits: z.enum(['screen_px', 'screen_norm', 'raw']).nullable(),
  /** Whether samples are now mapped to screen px. */
  mapping: z.boolean(),
});

export type SetGazeCalibrationRequest = z.infer<typeof setGazeCalibrationRequest>;
export type SetGazeCalibrationResponse = z.infer<typeof setGazeCalibrationResponse>;
