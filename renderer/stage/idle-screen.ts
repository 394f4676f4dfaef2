import type { Rgb, StageSurface } from './surface';

/** Mid-grey: the stage's resting luminance, between clips and after a blank. */
export const restingGrey: Rgb = [128, 128, 128];
const readyMark: Rgb = [96, 96, 96];

/**
 * Between clips the stage is mid-grey with a small darker square at the centre, so the
 * operator can see at a glance that the stage page is live and on the right display.
 */
export function drawIdleScreen(surface: StageSurface): void {
  const { width, height } = surface.canvas;
  surface.clear(restingGrey);
  const size = Math.max(4, Math.round(Math.min(width, height) / 60));
  surface.fillRect((width - size) / 2, (height - size) / 2, size, size, readyMark);
}
