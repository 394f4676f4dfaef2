import { z } from 'zod';
import { finite, nonNegativeInt } from './common';
import { sensorSize, stimulusIdField } from './stimuli';

const typed = <T>(ctor: { new (n: number): unknown; readonly name: string }) => z.custom<T>((value) => value instanceof ctor, `expected a ${ctor.name}`);

export const lookName = z.enum(['polarity', 'decay', 'grey']);
export const placementMode = z.enum(['fit', '1:1', 'integer']);

/** What the host tells the stage to do. Positions are stage pixels (the display's pixels when fullscreen). */
export const stageCommand = z.discriminatedUnion('type', [
  z.object({
    type: z.literal('prepareClip'),
    playbackId: z.string(),
    clip: stimulusIdField,
    sensor: sensorSize,
    tStartUs: finite,
    tEndUs: finite,
    speed: finite.refine((s) => s >= 0.1 && s <= 1, 'speed must be from 0.1 to 1'),
    look: lookName,
    placement: placementMode,
    /** The host time at which the clip's first instant is shown. */
    startAtHostNs: finite,
  }),
  z.object({ type: z.literal('pauseClip'), playbackId: z.string() }),
  z.object({ type: z.literal('resumeClip'), playbackId: z.string() }),
  z.object({ type: z.literal('stopClip'), playbackId: z.string() }),
  z.object({
    type: z.literal('showTarget'),
    id: z.string(),
    x: finite,
    y: finite,
    /** The target starts at outerPx radius and shrinks to innerPx over shrinkMs. */
    outerPx: finite,
    innerPx: finite,
    shrinkMs: finite,
  }),
  z.object({ type: z.literal('hideTarget'), id: z.string() }),
  z.object({ type: z.literal('setPhotodiode'), enabled: z.boolean() }),
  z.object({ type: z.literal('setMouseGaze'), enabled: z.boolean() }),
  /** Blank: mid-grey over everything until unblanked (the clip is paused by its own command). */
  z.object({ type: z.literal('setBlank'), blanked: z.boolean() }),
]);

/**
 * A clip's events on their way to the stage, in the compact form of .glev chunks:
 * t = baseUs + dt / ticksPerUs, x, y = yp >> 1, polarity = yp & 1. Eight bytes per event.
 */
export const stageEventChunk = z.object({
  playbackId: z.string(),
  baseUs: finite,
  ticksPerUs: z.union([z.literal(1), z.literal(1000)]),
  dt: typed<Uint32Array>(Uint32Array),
  x: typed<Uint16Array>(Uint16Array),
  yp: typed<Uint16Array>(Uint16Array),
  /** The last chunk of the clip. */
  last: z.boolean(),
});

export const frameRecord = z.object({
  frame: nonNegativeInt,
  stageTimeMs: finite,
  hostNs: finite,
  clip: z.string().nullable(),
  stimulusUs: finite.nullable(),
  eventsDrawn: nonNegativeInt,
  late: z.boolean(),
  photodiode: z.union([z.literal(0), z.literal(1)]).nullable(),
  /** How long the stage's own drawing of this frame took (ms, main thread); not recorded. */
  drawMs: finite.optional(),
});

export const reportFramesRequest = z
  .object({
    frames: z.array(frameRecord).max(10_000),
    clock: z.object({ offsetMs: finite, uncertaintyMs: finite }).nullable(),
    refreshHz: finite,
    /** The time of the last event the stage has received of the clip playing: the host streams only so far ahead of it. */
    received: z.object({ playbackId: z.string(), lastUs: finite.nullable() }).nullable(),
  })
  .strict();

export const playbackReport = z
  .object({
    playbackId: z.string(),
    state: z.enum(['started', 'paused', 'resumed', 'ended', 'stopped', 'failed']),
    hostNs: finite,
    stimulusUs: finite.nullable(),
    message: z.string().optional(),
  })
  .strict();

export const mouseGazeRequest = z
  .object({ samples: z.array(z.object({ stageTimeMs: finite, x: finite, y: finite, inside: z.boolean() })).max(1000) })
  .strict();

export type StageCommand = z.infer<typeof stageCommand>;
export type StageEventChunk = z.infer<typeof stageEventChunk>;
export type FrameRecordWire = z.infer<typeof frameRecord>;
