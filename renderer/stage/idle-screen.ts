import type { Rgb, StageSurface } from './surface';

/** Mid-grey: the stage's resting luminance, between clips and after a blank. */
export const restingGrey: Rgb = [128, 128, 128];
const readyMark: Rgb = [96, 96, 96];

/**
 * Before anything has been shown, the stage is mid-grey with a small darker square at the
 * centre, so the operator can see at a glance that the stage page is live and on the right
 * display. Once a session shows clips or targets, the resting screen is plain grey.
 */
export function drawIdleScreen(surface: StageSurface): void {
  const { width, height } = surface.canvas;
  const size = Math.max(4, Math.round(Math.min(width, height) / 60));
  surface.fillRect((width - size) / 2, (height - size) / 2, size, size, readyMark);
}
