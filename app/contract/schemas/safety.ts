import { z } from 'zod';
import { finite } from './common';

/**
 * The stage blank: the stage goes mid-grey and everything stops at once (the clip is paused,
 * a target procedure is cancelled, the console's session runner pauses). The console asks
 * with blankStage; the stage's own key calls the same channel from the stage page.
 */
export const blankStageRequest = z.object({ reason: z.string().trim().min(1).max(500) }).strict();

/** Who blanked the stage: the operator at the console, or the key on the stage page. */
export const blankedBy = z.enum(['console', 'stage_key']);

export const stageBlank = z.object({ by: blankedBy, reason: z.string(), hostNs: finite });

export const blankStageResponse = z.object({ blank: stageBlank.nullable() });

export type StageBlank = z.infer<typeof stageBlank>;
