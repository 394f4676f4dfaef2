import { z } from 'zod';
import { finite, nonNegativeInt, positiveInt } from './common';

/** Stimulus ids name folders on the host, so the contract admits only path-safe ones. */
export const stimulusIdField = z.string().regex(/^[a-z0-9][a-z0-9-]{0,79}$/, 'expected a stimulus id (lowercase letters, digits and hyphens)');

export const sensorSize = z.object({ width: positiveInt.max(65535), height: positiveInt.max(32767) });
export const timeUnit = z.enum(['us', 'ns', 'ms', 's']);

/** Where a stimulus came from; derived stimuli name their parent and the operation. */
export const stimulusSource = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('import'), file: z.string() }),
  z.object({ kind: z.literal('simulation'), scene: z.string(), seed: z.number().int(), objects: z.array(z.string()), recipeVersion: z.number().int() }),
  z.object({ kind: z.literal('operation'), parentId: stimulusIdField, operation: z.string(), parameters: z.record(z.string(), z.union([z.number(), z.string(), z.boolean()])) }),
]);

/** The flash screening's result (app/core/safety), field for field as `gazeloom events flash-check --json` prints it. */
export const flashRegion = z.object({
  x_px: finite,
  y_px: finite,
  width_px: finite,
  height_px: finite,
  left_deg: finite,
  top_deg: finite,
  right_deg: finite,
  bottom_deg: finite,
  solid_angle_sr: finite,
});
export const flashFailure = z.object({ start_s: finite, end_s: finite, region: flashRegion, flashes_per_s: finite, kind: z.enum(['general', 'red']) });
const flashDisplay = z.object({ widthMm: finite, heightMm: finite, widthPx: positiveInt, heightPx: positiveInt, distanceMm: finite });
export const flashLookResult = z.object({ look: z.enum(['polarity', 'decay', 'grey']), pass: z.boolean(), failures: z.array(flashFailure), frames: nonNegativeInt });
/** The library screens each clip in every look with the same viewing; it passes when every look passes. */
export const flashScreening = z.object({
  pass: z.boolean(),
  looks: z.array(flashLookResult),
  analysedWith: z.object({ speed: finite, placement: z.enum(['fit', '1:1', 'integer']), display: flashDisplay, rateHz: finite, analyserVersion: z.number().int(), cellSideDeg: finite }),
  analysedAt: z.string(),
});

export const stimulusMeta = z.object({
  id: stimulusIdField,
  name: z.string().min(1).max(200),
  notes: z.string().max(10000),
  createdAt: z.string(),
  source: stimulusSource,
  sensor: sensorSize,
  resolution: z.enum(['us', 'ns']),
  eventCount: nonNegativeInt,
  tStartUs: finite,
  tEndUs: finite,
  durationS: finite,
  /** Derived from `flash`: true when the screening fails or has not run yet (kept for the study records that mirror it). */
  mayFlash: z.boolean(),
  /** The flash screening (flash.json beside stats.json); missing or null until it has run. */
  flash: flashScreening.nullable().optional(),
  demo: z.boolean(),
  hasTracks: z.boolean(),
  warnings: z.array(z.string()),
});

export const rateSeries = z.object({ bin_s: finite, rate_hz: z.array(finite) });
export const hotPixel = z.object({ x: nonNegativeInt, y: nonNegativeInt, count: nonNegativeInt });

/** The figures of `gazeloom events stats --json`, field for field (app/core/events/stats). */
export const eventStats = z.object({
  count: nonNegativeInt,
  t_start_us: finite.nullable(),
  t_end_us: finite.nullable(),
  duration_s: finite,
  width: positiveInt,
  height: positiveInt,
  on_count: nonNegativeInt,
  off_count: nonNegativeInt,
  mean_rate_hz: finite.nullable(),
  peak_rate_hz: finite,
  rate_series: rateSeries,
  hot_pixels: z.object({ threshold_factor: finite, median_count: finite.nullable(), pixels: z.array(hotPixel) }),
});

export const importRequest = z
  .object({
    path: z.string().min(1),
    name: z.string().max(200).optional(),
    timeUnit: timeUnit.optional(),
    sensor: sensorSize.optional(),
    sort: z.boolean().optional(),
  })
  .strict();

export const stimulusOperation = z.discriminatedUnion('operation', [
  z.object({ operation: z.literal('trim'), fromUs: finite, toUs: finite }),
  z.object({ operation: z.literal('crop'), x0: nonNegativeInt, y0: nonNegativeInt, width: positiveInt, height: positiveInt }),
  z.object({ operation: z.literal('remove-hot-pixels') }),
  z.object({ operation: z.literal('background-activity'), dtUs: finite.refine((v) => v > 0, 'expected a positive dt') }),
]);

export const operateRequest = z.object({ id: stimulusIdField, name: z.string().max(200).optional(), apply: stimulusOperation }).strict();

export const updateStimulusRequest = z
  .object({ id: stimulusIdField, name: z.string().min(1).max(200).optional(), notes: z.string().max(10000).optional() })
  .strict();

export const stimulusId = z.object({ id: stimulusIdField }).strict();

export const eventWindowRequest = z
  .object({ id: stimulusIdField, fromUs: finite, toUs: finite, maxEvents: positiveInt.max(8_000_000).optional() })
  .strict();

/** Events as the four typed columns of app/core/events/event-batch.ts (binary on the wire). */
const column = <T>(ctor: { new (n: number): unknown; readonly name: string }) => z.custom<T>((value) => value instanceof ctor, `expected a ${ctor.name}`);

export const eventColumns = z
  .object({
    t: column<Float64Array>(Float64Array),
    x: column<Uint16Array>(Uint16Array),
    y: column<Uint16Array>(Uint16Array),
    p: column<Uint8Array>(Uint8Array),
  })
  .refine((c) => c.x.length === c.t.length && c.y.length === c.t.length && c.p.length === c.t.length, 'the four columns must have the same length');

export const eventWindow = z.object({ events: eventColumns, truncated: z.boolean() });

export type StimulusMeta = z.infer<typeof stimulusMeta>;
export type FlashScreening = z.infer<typeof flashScreening>;
export type EventStats = z.infer<typeof eventStats>;
export type StimulusOperation = z.infer<typeof stimulusOperation>;
export type ImportRequest = z.infer<typeof importRequest>;
