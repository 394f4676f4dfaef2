import { allocateBatch, type EventBatch, type SensorSize } from '../../../../app/core/events/event-batch';

export const TEST_SENSOR: SensorSize = { width: 160, height: 90 };
/** The library's screening display: fitting 160 x 90 gives exactly 12 screen pixels per sensor pixel. */
export const TEST_DISPLAY = { widthMm: 530, heightMm: 298, widthPx: 1920, heightPx: 1080, distanceMm: 600 } as const;
export const FRAME_US = 1e6 / 60;

export interface SquareFlash {
  readonly flashesPerS: number;
  /** Side of the flashing square in sensor pixels, centred on the sensor. */
  readonly side: number;
  readonly durationS: number;
}

/**
 * A clip whose polarity-look image flashes: during the bright half of each flash period, every
 * pixel of the square gets an ON event 0.3 frame before each 60 Hz frame (so exactly that
 * frame shows it in the amber ON colour, and at half speed exactly two frames, never a frame's
 * own time); in the dark half it shows the grey background.
 * One OFF event in the corner at t = 0 and one at the end mark the clip's extent.
 */
export function squareFlashClip({ flashesPerS, side, durationS }: SquareFlash): EventBatch {
  const frames = Math.round(durationS * 60);
  const x0 = (TEST_SENSOR.width - side) / 2;
  const y0 = (TEST_SENSOR.height - side) / 2;
  const rows: Array<[number, number, number, number]> = [[0, 0, 0, 0]];
  for (let k = 1; k <= frames; k++) {
    if (Math.floor((2 * flashesPerS * k) / 60) % 2 !== 0) continue;
    const t = (k - 0.3) * FRAME_US;
    for (let y = y0; y < y0 + side; y++) for (let x = x0; x < x0 + side; x++) rows.push([t, x, y, 1]);
  }
  rows.push([frames * FRAME_US, 0, 0, 0]);
  const batch = allocateBatch(rows.length);
  rows.forEach(([t, x, y, p], i) => {
    batch.t[i] = t;
    batch.x[i] = x;
    batch.y[i] = y;
    batch.p[i] = p;
  });
  return batch;
}
