import { z } from 'zod';
import { finite, nonNegativeInt, positiveInt } from './common';

export const appInfo = z.object({
  name: z.literal('Gazeloom'),
  version: z.string(),
  mode: z.enum(['electron', 'browser']),
  platform: z.string(),
  dataDir: z.string(),
  /** Wall-clock time the host started (ISO 8601); host times count from this moment. */
  startedAt: z.string(),
});

export const pingRequest = z.object({ clientSentMs: finite }).strict();
export const pingResponse = z.object({ hostReceivedNs: finite, hostSentNs: finite });

export const displayInfo = z.object({
  id: z.string(),
  label: z.string(),
  bounds: z.object({ x: z.number().int(), y: z.number().int(), width: positiveInt, height: positiveInt }),
  scaleFactor: finite,
  refreshHz: finite.nullable(),
  primary: z.boolean(),
});

export const displayList = z.object({
  displays: z.array(displayInfo),
  /** False in browser mode: the operator drags the stage window to the display instead. */
  canChoose: z.boolean(),
});

export const openStageRequest = z.object({ displayId: z.string().nullable() }).strict();
export const openStageResponse = z.discriminatedUnion('how', [
  z.object({ how: z.literal('window'), displayId: z.string() }),
  z.object({ how: z.literal('url'), url: z.string() }),
]);

export const stageStatus = z.object({
  visible: z.boolean(),
  width: nonNegativeInt,
  height: nonNegativeInt,
  devicePixelRatio: finite,
  renderer: z.enum(['webgl2', 'canvas2d']),
});

export const stageStatusEvent = stageStatus.extend({ connected: z.boolean() });

export const firstRunTask = z.object({
  id: z.string(),
  label: z.string(),
  state: z.enum(['pending', 'running', 'done', 'failed']),
  progress: z.number().min(0).max(1),
  message: z.string(),
});

export const firstRunStatus = z.object({ tasks: z.array(firstRunTask) });

export type AppInfo = z.infer<typeof appInfo>;
export type DisplayInfo = z.infer<typeof displayInfo>;
export type StageStatus = z.infer<typeof stageStatus>;
export type StageStatusEvent = z.infer<typeof stageStatusEvent>;
export type FirstRunTask = z.infer<typeof firstRunTask>;
