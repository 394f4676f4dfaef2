import type { StageSurface } from './surface';

export const PHOTODIODE_SIZE_PX = 48;

/**
 * The photodiode patch in the bottom-left corner, for labs that measure real display
 * latency: it alternates black and white on every frame while a clip plays and stays
 * black otherwise. Each frame's state goes into the frame log.
 */
export class PhotodiodePatch {
  enabled = false;
  private white = false;

  draw(surface: StageSurface, playing: boolean): 0 | 1 | null {
    if (!this.enabled) return null;
    this.white = playing ? !this.white : false;
    const state = this.white ? 1 : 0;
    surface.fillRect(0, surface.canvas.height - PHOTODIODE_SIZE_PX, PHOTODIODE_SIZE_PX, PHOTODIODE_SIZE_PX, state ? [255, 255, 255] : [0, 0, 0]);
    return state;
  }
}
