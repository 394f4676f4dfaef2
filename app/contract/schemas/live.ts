import { z } from 'zod';
import { finite, nonNegativeInt, positiveInt } from './common';
import { stageBlank } from './safety';
import { lookName, placementMode } from './stage';
import { stimulusIdField } from './stimuli';

const positive = finite.refine((v) => v > 0, 'expected a positive number');

export const displayGeometry = z.object({
  widthMm: positive,
  heightMm: positive,
  widthPx: positiveInt,
  heightPx: positiveInt,
  distanceMm: positive,
});

/** Where gaze comes from in a live recording. */
export const gazeSourceChoice = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('simulated'),
    seed: z.number().int().nonnegative(),
    rateHz: positive,
    noiseDeg: finite.nonnegative().optional(),
    driftDegPerMin: finite.optional(),
    accuracyOffsetDeg: finite.nonnegative().optional(),
    lossPct: finite.min(0).max(100).optional(),
    latencyMs: finite.nonnegative().optional(),
    offsetS: finite.optional(),
    skewPpm: finite.optional(),
  }),
  z.object({ kind: z.literal('feed'), url: z.string().regex(/^(udp|tcp|ws):\/\/[^/]+:\d+$/, 'expected udp://HOST:PORT, tcp://HOST:PORT or ws://HOST:PORT') }),
  z.object({ kind: z.literal('mouse') }),
]);

export const startRecordingRequest = z.object({ source: gazeSourceChoice, display: displayGeometry, label: z.string().max(200).optional() }).strict();
export const startRecordingResponse = z.object({ sessionId: z.string(), dir: z.string() });
export const stopRecordingResponse = z.object({ sessionId: z.string(), samples: nonNegativeInt, frames: nonNegativeInt, messages: nonNegativeInt });

export const playClipRequest = z
  .object({ stimulusId: stimulusIdField, speed: finite.min(0.1).max(1), look: lookName, placement: placementMode, photodiode: z.boolean() })
  .strict();

export const liveStatus = z.object({
  recording: z.object({ sessionId: z.string(), dir: z.string(), samples: nonNegativeInt, frames: nonNegativeInt }).nullable(),
  source: z
    .object({
      kind: z.string(),
      description: z.string(),
      connected: z.boolean(),
      nominalRateHz: finite.nullable(),
    })
    .nullable(),
  measuredRateHz: finite.nullable(),
  /** Invalid or missing samples over expected ones in the last 10 s, %. */
  dataLossPct10s: finite.nullable(),
  clockOffsetS: finite.nullable(),
  clockUncertaintyMs: finite.nullable(),
  stageClockUncertaintyMs: finite.nullable(),
  framesTotal: nonNegativeInt,
  framesLate: nonNegativeInt,
  garbageLines: nonNegativeInt,
  lastSampleAgeMs: finite.nullable(),
  /** No sample for 500 ms while a source is running. */
  alarm: z.boolean(),
  /** Recent gaze (about the last half second), screen px; null entries are invalid samples. */
  trail: z.array(z.object({ x: finite, y: finite }).nullable()),
  playback: z
    .object({ playbackId: z.string(), clip: z.string(), state: z.string(), stimulusUs: finite.nullable(), sensor: z.object({ width: positiveInt, height: positiveInt }), placement: placementMode })
    .nullable(),
  display: displayGeometry.nullable(),
  /** The frames of the clip playing now, or of the last one: how many, how many late, and the stage's draw time per frame. */
  clipFrames: z.object({ frames: nonNegativeInt, late: nonNegativeInt, drawMsP50: finite.nullable(), drawMsP99: finite.nullable() }).nullable(),
  /** The stage is blanked (null: it is not). */
  blank: stageBlank.nullable(),
});

export const playTestPatternRequest = z
  .object({
    eventsPerSecond: finite.min(1).max(1e9),
    width: positiveInt.max(4096),
    height: positiveInt.max(4096),
    durationS: finite.min(0.1).max(600),
    look: lookName,
    placement: placementMode,
  })
  .strict();

export type LiveStatus = z.infer<typeof liveStatus>;
export type GazeSourceChoice = z.infer<typeof gazeSourceChoice>;

export const recoveredSession = z.object({
  sessionId: z.string(),
  dir: z.string(),
  samples: nonNegativeInt,
  frames: nonNegativeInt,
  messages: nonNegativeInt,
  tornTailBytes: nonNegativeInt,
  corruptChunks: nonNegativeInt,
  resumable: z.boolean(),
});

export const resumeRecordingRequest = z.object({ sessionId: z.string() }).strict();

/** A target on the stage (screen px), e.g. to check that gaze lands where the participant looks. */
export const showTargetRequest = z.object({ x: finite, y: finite, purpose: z.enum(['calibration', 'validation', 'drift_check']) }).strict();
export const showTargetResponse = z.object({ targetId: z.string() });
export const hideTargetRequest = z.object({ targetId: z.string() }).strict();
