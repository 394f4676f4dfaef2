import { z } from 'zod';
import { targetResult } from '../../core/study/records';
import { finite, nonNegativeInt } from './common';

export const targetPurpose = z.enum(['calibration', 'validation', 'drift_check']);

/**
 * Targets shown one after another on the stage during a recording, each for holdMs, with
 * the gaze of the window fromMs..toMs after its onset (both ends included) measured
 * against it. Points are screen pixels (origin top-left). A random order is drawn from the
 * seed (a seed is drawn and returned when none is given).
 */
export const runTargetProcedureRequest = z
  .object({
    purpose: targetPurpose,
    points: z.array(z.object({ x: finite, y: finite }).strict()).min(1).max(50),
    order: z.enum(['as_given', 'random']),
    seed: z.number().int().nonnegative().max(0xffffffff).optional(),
    fromMs: finite.min(0).max(10_000).optional(),
    toMs: finite.min(1).max(10_000).optional(),
    holdMs: finite.min(100).max(10_000).optional(),
  })
  .strict();

/** One target as shown: its result, its place in the request, and when it appeared. */
export const shownTargetResult = targetResult.extend({
  /** Index of the point in the request's points. */
  index: nonNegativeInt,
  targetId: z.string(),
  /** Host time at which the host told the stage to show it (the window is counted from here). */
  onsetHostNs: finite,
  /** Mean of the window's valid samples in the units the tracker sends (screen px, or raw coordinates for a later calibration fit). */
  meanGaze: z.object({ x: finite, y: finite }).nullable(),
});

export const runTargetProcedureResponse = z.object({
  sessionId: z.string(),
  purpose: targetPurpose,
  /** In the order shown. */
  points: z.array(shownTargetResult),
  /** The seed of a random order, null for 'as_given'. */
  seed: z.number().int().nullable(),
  /** The gaze units of the source: with 'raw' the angles are null (no mapping to the screen yet). */
  gazeUnits: z.enum(['screen_px', 'screen_norm', 'raw']).nullable(),
  startedHostNs: finite,
  endedHostNs: finite,
});

export type RunTargetProcedureRequest = z.infer<typeof runTargetProcedureRequest>;
export type RunTargetProcedureResponse = z.infer<typeof runTargetProcedureResponse>;
export type ShownTargetResult = z.infer<typeof shownTargetResult>;
