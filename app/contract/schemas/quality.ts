import { z } from 'zod';
import { finite, nonNegativeInt } from './common';

const typed = <T>(ctor: { new (n: number): unknown; readonly name: string }) => z.custom<T>((value) => value instanceof ctor, `expected a ${ctor.name}`);

export const sessionQualityRequest = z.object({
  /** The recording's session id (its folder under the data folder's recordings/). */
  sessionId: z.string().min(1).max(200),
  /** Width of the time bins, seconds (default 10). */
  binS: finite.min(0.1).max(3600).optional(),
  /** Also send the gaze series for plots (typed arrays: one value per sample). */
  gaze: z.boolean().optional(),
});

/** A session recording's quality over time (app/host/quality/session-series.ts); bins start at the first gaze sample. */
export const sessionQualityResponse = z.object({
  firstSampleHostNs: finite.nullable(),
  /** The tracker's nominal rate (its hello), else 1 / the median sample interval. */
  rateHz: finite.nullable(),
  samples: nonNegativeInt,
  dataLoss: z.object({ binS: finite, pct: z.array(finite), expected: z.array(finite), valid: z.array(nonNegativeInt), overallPct: finite.nullable() }),
  lateFrames: z.object({ binS: finite, frames: z.array(nonNegativeInt), late: z.array(nonNegativeInt), totalFrames: nonNegativeInt, totalLate: nonNegativeInt }),
  /** Seconds from the first sample; screen px with NaN for invalid samples. */
  gaze: z.object({ timeS: typed<Float64Array>(Float64Array), x: typed<Float32Array>(Float32Array), y: typed<Float32Array>(Float32Array) }).optional(),
});

export type SessionQualityResponse = z.infer<typeof sessionQualityResponse>;
