import type { SensorSize } from '../events/event-batch';
import { pixelsPerDegreeAtCentre, type DisplayGeometry } from '../geometry/display-geometry';
import { placeSensor, type PlacementMode } from '../geometry/placement';
import { CELL_SIDE_DEG } from './flash-thresholds';
import { rectangleSolidAngle } from './solid-angle';

/** A screen rectangle in pixels, [x0, x1) x [y0, y1). */
export interface PxRect {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/**
 * The screening cells: the clip's image on the screen cut into squares of about one degree,
 * each a block of whole sensor pixels (uniform placement scale, so the mean over a cell's
 * sensor pixels is the mean over its screen pixels). Only the image is covered: the
 * letterbox never changes, so it cannot flash.
 */
export interface FlashCells {
  readonly cols: number;
  readonly rows: number;
  /** Sensor pixels in all (width * height), on screen or not. */
  readonly pixelCount: number;
  readonly pixelsInCell: Float64Array;
  readonly screen: readonly PxRect[];
  readonly solidAngleSr: Float64Array;
  /** Unit vectors from the eye to each cell's centre, x, y, z interleaved. */
  readonly direction: Float64Array;
  /** Sensor pixels per cell side; cell (col, row) starts at sensor pixel (visible.x0 + col * sidePx, visible.y0 + row * sidePx). */
  readonly sidePx: number;
  /** The sensor pixels on screen, [x0, x1) x [y0, y1), and the sensor's row length. */
  readonly visible: PxRect;
  readonly sensorWidth: number;
  readonly display: DisplayGeometry;
}

/** Sensor columns (or rows) whose centres land on the screen: [first, end). */
function visibleRange(count: number, offset: number, scale: number, screenPx: number): [number, number] {
  const first = Math.max(0, Math.ceil((0 - offset) / scale - 0.5));
  const end = Math.min(count, Math.ceil((screenPx - offset) / scale - 0.5));
  return [first, Math.max(first, end)];
}

export function flashCells(sensor: SensorSize, display: DisplayGeometry, mode: PlacementMode): FlashCells {
  const placement = placeSensor(sensor, display, mode);
  const { scale, left, top } = placement;
  const sidePx = Math.max(1, Math.round((CELL_SIDE_DEG * pixelsPerDegreeAtCentre(display)) / scale));
  const [fx, ex] = visibleRange(sensor.width, left, scale, display.widthPx);
  const [fy, ey] = visibleRange(sensor.height, top, scale, display.heightPx);
  const cols = Math.ceil((ex - fx) / sidePx);
  const rows = Math.ceil((ey - fy) / sidePx);
  const pixelsInCell = new Float64Array(cols * rows);
  for (let row = 0; row < rows; row++) {
    for (let col = 0; col < cols; col++) {
      const w = Math.min(ex, fx + (col + 1) * sidePx) - (fx + col * sidePx);
      const h = Math.min(ey, fy + (row + 1) * sidePx) - (fy + row * sidePx);
      pixelsInCell[row * cols + col] = w * h;
    }
  }
  const mmPerPxX = display.widthMm / display.widthPx;
  const mmPerPxY = display.heightMm / display.heightPx;
  const screen: PxRect[] = [];
  const solidAngleSr = new Float64Array(cols * rows);
  const direction = new Float64Array(cols * rows * 3);
  for (let row = 0; row < rows; row++) {
    for (let col = 0; col < cols; col++) {
      const i = row * cols + col;
      const clampX = (sx: number) => Math.min(display.widthPx, Math.max(0, left + sx * scale));
      const clampY = (sy: number) => Math.min(display.heightPx, Math.max(0, top + sy * scale));
      const rect = { x0: clampX(fx + col * sidePx), y0: clampY(fy + row * sidePx), x1: clampX(Math.min(ex, fx + (col + 1) * sidePx)), y1: clampY(Math.min(ey, fy + (row + 1) * sidePx)) };
      screen.push(rect);
      const mm = (px: number, size: number, per: number) => (px - size / 2) * per;
      const [x0, x1] = [mm(rect.x0, display.widthPx, mmPerPxX), mm(rect.x1, display.widthPx, mmPerPxX)];
      const [y0, y1] = [mm(rect.y0, display.heightPx, mmPerPxY), mm(rect.y1, display.heightPx, mmPerPxY)];
      solidAngleSr[i] = rectangleSolidAngle(x0, y0, x1, y1, display.distanceMm);
      const cx = (x0 + x1) / 2;
      const cy = (y0 + y1) / 2;
      const norm = Math.hypot(cx, cy, display.distanceMm);
      direction.set([cx / norm, cy / norm, display.distanceMm / norm], i * 3);
    }
  }
  return { cols, rows, pixelCount: sensor.width * sensor.height, pixelsInCell, screen, solidAngleSr, direction, sidePx, visible: { x0: fx, y0: fy, x1: ex, y1: ey }, sensorWidth: sensor.width, display };
}
