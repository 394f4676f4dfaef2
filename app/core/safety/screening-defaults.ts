import type { FlashSettings } from './flash-result';

/**
 * How the library screens every clip when nobody says otherwise: the console's default
 * session display (a 24-inch 16:9 monitor, 530 x 298 mm at 1920 x 1080, seen from 600 mm),
 * 60 Hz, the clip fitted to the screen (the largest placement) at full speed (the fastest
 * flashing), once per look. A lab with another display or viewing distance screens again
 * with `gazeloom events flash-check`.
 */
export const LIBRARY_SCREENING: Omit<FlashSettings, 'look'> = {
  speed: 1,
  placement: 'fit',
  display: { widthMm: 530, heightMm: 298, widthPx: 1920, heightPx: 1080, distanceMm: 600 },
  rateHz: 60,
};
