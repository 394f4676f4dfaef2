import type { EyeSample } from '../gaze-sample';
import type { FeedHeader } from './feed-header';

/** Screen pixels per unit of x and y: the screen size for screen_norm, 1 otherwise. */
export function coordinateScale(header: FeedHeader): { readonly x: number; readonly y: number } {
  const { units, screen } = header.hello;
  return units === 'screen_norm' && screen ? { x: screen.widthPx, y: screen.heightPx } : { x: 1, y: 1 };
}

/**
 * One eye from already-read wire values. A valid eye needs finite coordinates; an invalid
 * one (blink, lost tracking) is kept, with NaN where the sender left its coordinates out.
 * Returns the reason when the values cannot stand for an eye.
 */
export function eyeFrom(
  name: string,
  x: number | null,
  y: number | null,
  valid: boolean,
  pupil: number | null,
  scale: { readonly x: number; readonly y: number },
): EyeSample | string {
  const finite = x !== null && y !== null && Number.isFinite(x) && Number.isFinite(y);
  if (valid && !finite) return `sample: eye "${name}" is marked valid but its x, y are not finite numbers`;
  if (pupil !== null && !Number.isFinite(pupil)) return `sample: eye "${name}" pupil must be a finite number or left out`;
  return finite ? { x: x * scale.x, y: y * scale.y, valid, pupil } : { x: Number.NaN, y: Number.NaN, valid, pupil };
}
