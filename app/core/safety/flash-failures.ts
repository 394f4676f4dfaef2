import { screenPxToDeg } from '../geometry/display-geometry';
import { screenPoint } from '../geometry/units';
import type { FlashCells } from './flash-cells';
import { flashesInWindow, type FlashPairs } from './flash-pairs';
import type { FlashFailure, FlashKind } from './flash-result';
import { FLASH_AREA_LIMIT_SR, MAX_FLASHES_PER_WINDOW, VISUAL_FIELD_DIAMETER_DEG } from './flash-thresholds';

interface Timing {
  readonly windowFrames: number;
  /** Clip seconds per frame (speed / rate). */
  readonly clipSPerFrame: number;
}

/** What one cell did in the failing windows of a run. */
interface CellHazard {
  count: number;
  first: number;
  last: number;
}

/** Cells whose centres lie within half the visual field of each cell's centre (computed once, when needed). */
function fieldMembers(cells: FlashCells): Int32Array[] {
  const n = cells.cols * cells.rows;
  const cos = Math.cos(((VISUAL_FIELD_DIAMETER_DEG / 2) * Math.PI) / 180);
  const d = cells.direction;
  return Array.from({ length: n }, (_, i) => {
    const members: number[] = [];
    for (let j = 0; j < n; j++) if (d[3 * i]! * d[3 * j]! + d[3 * i + 1]! * d[3 * j + 1]! + d[3 * i + 2]! * d[3 * j + 2]! >= cos) members.push(j);
    return Int32Array.from(members);
  });
}

/**
 * The failures of one kind of flash: in a one-second window, a cell is hazardous when it
 * flashes more than three times; the window fails where the hazardous cells inside one
 * 10-degree field (centred on any cell) add up to more than 0.006 sr. Overlapping failing
 * windows join into one time range, and each connected patch of failing cells in it is one
 * failure. Windows start at flash starts, where the count of any window can last rise.
 */
export function flashFailures(kind: FlashKind, pairs: FlashPairs, cells: FlashCells, timing: Timing): FlashFailure[] {
  const n = cells.cols * cells.rows;
  const busy = [...Array(n).keys()].filter((c) => pairs.starts[c]!.length > MAX_FLASHES_PER_WINDOW);
  if (busy.length === 0) return [];
  const windowStarts = [...new Set(busy.flatMap((c) => pairs.starts[c]!))].sort((a, b) => a - b);
  let members: Int32Array[] | null = null;
  const hazardArea = new Float64Array(n);
  const failingMark = new Uint8Array(n);
  const fieldSeen = new Uint8Array(n);
  const runs: Array<{ endFrame: number; cells: Map<number, CellHazard> }> = [];
  for (const from of windowStarts) {
    const hazards = new Map<number, CellHazard>();
    for (const c of busy) {
      const [first, end] = flashesInWindow(pairs.starts[c]!, pairs.ends[c]!, from, timing.windowFrames);
      if (end - first > MAX_FLASHES_PER_WINDOW) hazards.set(c, { count: end - first, first: pairs.starts[c]![first]!, last: pairs.ends[c]![end - 1]! });
    }
    if (hazards.size === 0) continue;
    members ??= fieldMembers(cells);
    for (const c of hazards.keys()) hazardArea[c] = cells.solidAngleSr[c]!;
    const fields: number[] = [];
    for (const c of hazards.keys()) for (const f of members[c]!) if (!fieldSeen[f]) (fieldSeen[f] = 1), fields.push(f);
    for (const f of fields) {
      fieldSeen[f] = 0;
      const inField = members[f]!;
      let area = 0;
      for (let k = 0; k < inField.length; k++) area += hazardArea[inField[k]!]!;
      if (area > FLASH_AREA_LIMIT_SR) for (let k = 0; k < inField.length; k++) if (hazardArea[inField[k]!]! > 0) failingMark[inField[k]!] = 1;
    }
    const failing = new Map<number, CellHazard>();
    for (const [c, h] of hazards) {
      if (failingMark[c]) failing.set(c, h);
      hazardArea[c] = 0;
      failingMark[c] = 0;
    }
    if (failing.size === 0) continue;
    const run = runs.at(-1);
    if (run && from < run.endFrame) {
      run.endFrame = from + timing.windowFrames;
      for (const [c, h] of failing) {
        const seen = run.cells.get(c);
        run.cells.set(c, seen ? { count: Math.max(seen.count, h.count), first: Math.min(seen.first, h.first), last: Math.max(seen.last, h.last) } : { ...h });
      }
    } else {
      runs.push({ endFrame: from + timing.windowFrames, cells: failing });
    }
  }
  return runs.flatMap((run) => patches(run.cells, cells).map((patch) => describe(kind, patch, run.cells, cells, timing)));
}

/** Connected patches (8-neighbour) of failing cells. */
function patches(failing: Map<number, CellHazard>, cells: FlashCells): number[][] {
  const seen = new Set<number>();
  const out: number[][] = [];
  for (const start of [...failing.keys()].sort((a, b) => a - b)) {
    if (seen.has(start)) continue;
    const patch: number[] = [];
    const stack = [start];
    seen.add(start);
    while (stack.length > 0) {
      const c = stack.pop()!;
      patch.push(c);
      const col = c % cells.cols;
      const row = (c - col) / cells.cols;
      for (let dy = -1; dy <= 1; dy++) {
        for (let dx = -1; dx <= 1; dx++) {
          const x = col + dx;
          const y = row + dy;
          const next = y * cells.cols + x;
          if (x >= 0 && y >= 0 && x < cells.cols && y < cells.rows && failing.has(next) && !seen.has(next)) {
            seen.add(next);
            stack.push(next);
          }
        }
      }
    }
    out.push(patch);
  }
  return out;
}

const round = (value: number, digits: number) => Number(value.toFixed(digits));

function describe(kind: FlashKind, patch: number[], hazards: Map<number, CellHazard>, cells: FlashCells, timing: Timing): FlashFailure {
  const display = cells.display;
  const rects = patch.map((c) => cells.screen[c]!);
  const x0 = Math.min(...rects.map((r) => r.x0));
  const y0 = Math.min(...rects.map((r) => r.y0));
  const x1 = Math.max(...rects.map((r) => r.x1));
  const y1 = Math.max(...rects.map((r) => r.y1));
  const topLeft = screenPxToDeg(display, screenPoint(x0, y0));
  const bottomRight = screenPxToDeg(display, screenPoint(x1, y1));
  const h = patch.map((c) => hazards.get(c)!);
  return {
    start_s: round(Math.min(...h.map((x) => x.first)) * timing.clipSPerFrame, 4),
    end_s: round(Math.max(...h.map((x) => x.last)) * timing.clipSPerFrame, 4),
    region: {
      x_px: round(x0, 1),
      y_px: round(y0, 1),
      width_px: round(x1 - x0, 1),
      height_px: round(y1 - y0, 1),
      left_deg: round(topLeft.x, 2),
      top_deg: round(topLeft.y, 2),
      right_deg: round(bottomRight.x, 2),
      bottom_deg: round(bottomRight.y, 2),
      solid_angle_sr: round(patch.reduce((sum, c) => sum + cells.solidAngleSr[c]!, 0), 5),
    },
    flashes_per_s: Math.max(...h.map((x) => x.count)),
    kind,
  };
}
