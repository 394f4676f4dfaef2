import { z } from 'zod';
import { finite, nonNegativeInt } from './common';

/** How long the session is expected to record, and at what gaze rate, to size the disk check. */
export const preflightRequest = z
  .object({
    expectedSeconds: finite.refine((v) => v >= 0 && v <= 7 * 24 * 3600, 'expected 0 to 604800 seconds'),
    rateHz: finite.refine((v) => v > 0 && v <= 100_000, 'expected a rate above 0 and at most 100000 Hz'),
  })
  .strict();

export const preflightResponse = z.object({
  /** Bytes free for this user on the file system that holds the recordings. */
  freeBytes: nonNegativeInt,
  /** What a recording of that length needs, with a safety margin. */
  neededBytes: nonNegativeInt,
  recordingsDir: z.string(),
});

export type PreflightReport = z.infer<typeof preflightResponse>;
