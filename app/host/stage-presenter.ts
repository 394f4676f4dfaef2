import type { z } from 'zod';
import type { Failure } from '../contract';
import type { displayList, openStageResponse } from '../contract/schemas/app';

/**
 * Puts the stage on a display. Electron opens a fullscreen window on the chosen screen;
 * browser mode cannot place windows, so it hands the console the stage's address instead.
 */
export interface StagePresenter {
  listDisplays(): z.infer<typeof displayList>;
  open(displayId: string | null): z.infer<typeof openStageResponse> | Failure;
}

export function browserStagePresenter(stageUrl: () => string): StagePresenter {
  return {
    listDisplays: () => ({ displays: [], canChoose: false }),
    open: () => ({ how: 'url', url: stageUrl() }),
  };
}
