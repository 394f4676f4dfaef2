import { describe, expect, it } from 'vitest';
import { EventFormatError } from '../../../../app/core/events/event-format-error';
import { formatTracksTsv, TRACKS_TSV_HEADER, type TrackRow } from '../../../../app/core/sim/track-rows';
import { WarehouseScene } from '../../../../app/core/sim/warehouse-scene';
import { parseTracksTsv, TrackTable } from '../../../../app/core/tracker-sim';

// The format is the one the event-streams simulator writes (README, "TRACKS.tsv: ground
// truth of simulated clips"); the oracle is that writer, formatTracksTsv.

const row = (tS: number, objectId: number, cx: number, cy: number, half = 5): TrackRow => ({ tS, objectId, kind: 'forklift', cx, cy, x0: cx - half, y0: cy - half, x1: cx + half, y1: cy + half });

function parseError(text: string): EventFormatError {
  try {
    parseTracksTsv(text, 'clip/TRACKS.tsv');
  } catch (e) {
    if (e instanceof EventFormatError) return e;
    throw e;
  }
  throw new Error('expected an EventFormatError');
}

describe('parseTracksTsv', () => {
  it('reads back what the warehouse simulator writes, row for row', () => {
    const scene = new WarehouseScene({ width: 640, height: 480 });
    const rows = Array.from({ length: 500 }, (_, ms) => scene.objectsAt(ms / 1000)).flat();
    const table = parseTracksTsv(formatTracksTsv(rows), 'TRACKS.tsv');
    // The file keeps 2 decimals of position and 6 of time.
    for (const r of rows.filter((_, i) => i % 37 === 0)) {
      const back = table.objectAt(r.objectId, Number(r.tS.toFixed(6)))!;
      expect(back.kind).toBe(r.kind);
      for (const f of ['cx', 'cy', 'x0', 'y0', 'x1', 'y1'] as const) expect(Math.abs(back[f] - r[f])).toBeLessThanOrEqual(0.005 + 1e-9);
    }
    expect(table.objectIds).toEqual([...new Set(rows.map((r) => r.objectId))].sort((a, b) => a - b));
    expect(table.startS).toBe(0);
    expect(table.endS).toBeCloseTo(0.499, 9);
  });

  it('accepts CRLF line ends, a byte-order mark and blank lines', () => {
    const text = `\uFEFF${formatTracksTsv([row(0, 1, 10, 20), row(0.001, 1, 11, 20)]).replaceAll('\n', '\r\n')}\r\n\r\n`;
    expect(parseTracksTsv(text, 'TRACKS.tsv').objectAt(1, 0.001)?.cx).toBe(11);
  });

  it('names the file and the line of every problem', () => {
    const good = formatTracksTsv([row(0, 1, 10, 20)]);
    expect(parseError('t_s\tid\n').message).toMatch(/^clip\/TRACKS\.tsv line 1: expected the header "t_s object_id kind cx cy x0 y0 x1 y1"/);
    expect(parseError('').message).toMatch(/line 1: expected the header/);
    expect(parseError(`${good}0.001\t1\tforklift\t10\t20\n`).message).toBe('clip/TRACKS.tsv line 3: expected 9 tab-separated fields (t_s object_id kind cx cy x0 y0 x1 y1), got 5');
    expect(parseError(`${good}0.001\t1\tforklift\tabc\t20\t5\t15\t15\t25\n`).message).toBe('clip/TRACKS.tsv line 3: cx must be a number, got "abc"');
    expect(parseError(`${good}\n0.001\t1\tforklift\t\t20\t5\t15\t15\t25\n`).message).toBe('clip/TRACKS.tsv line 4: cx must be a number, got ""');
    expect(parseError(`${good}0.001\t1.5\tforklift\t10\t20\t5\t15\t15\t25\n`).message).toMatch(/line 3: object_id must be a whole number >= 0, got "1.5"/);
    expect(parseError(`${good}0.001\t2\ttruck\t10\t20\t5\t15\t15\t25\n`).message).toMatch(/line 3: kind must be one of forklift, parcel, beacon, person, flickering-light, got "truck"/);
    expect(parseError(`${good}-0.001\t2\tparcel\t10\t20\t5\t15\t15\t25\n`).message).toMatch(/line 3: t_s must be >= 0/);
    expect(parseError(`${good}0.001\t2\tparcel\t10\t20\t15\t15\t5\t25\n`).message).toMatch(/line 3: x1 \(5\) must be >= x0 \(15\)/);
    expect(parseError(`${good}0.001\t2\tparcel\t10\t20\t5\t25\t15\t15\n`).message).toMatch(/line 3: y1 \(15\) must be >= y0 \(25\)/);
    expect(parseError(`${good}0\t1\tforklift\t10\t20\t5\t15\t15\t25\n`).message).toBe('clip/TRACKS.tsv line 3: object 1 at t_s 0 does not come after its previous row at t_s 0');
    expect(parseError(`${good}0.001\t1\tperson\t10\t20\t5\t15\t15\t25\n`).message).toMatch(/line 3: object 1 is a forklift in earlier rows, not a person/);
  });

  it('reads a header-only file as a clip with no objects', () => {
    const table = parseTracksTsv(`${TRACKS_TSV_HEADER}\n`, 'TRACKS.tsv');
    expect(table.objectIds).toEqual([]);
    expect(table.objectsAt(0)).toEqual([]);
  });
});

describe('TrackTable', () => {
  // One row per millisecond, then the object leaves for 100 ms and comes back.
  const rows = [...Array.from({ length: 11 }, (_, i) => row(i / 1000, 7, 100 + i, 50)), ...Array.from({ length: 5 }, (_, i) => row(0.11 + i / 1000, 7, 300, 60))];
  const table = TrackTable.fromRows(rows);

  it('interpolates linearly between rows of an object', () => {
    const r = table.objectAt(7, 0.0025)!;
    expect(r.cx).toBeCloseTo(102.5, 9);
    expect(r.x0).toBeCloseTo(97.5, 9);
    expect(r.tS).toBe(0.0025);
    expect(table.objectAt(7, 0.01)!.cx).toBe(110);
  });

  it('has an object only while it has rows: not before, after, in a long gap, or for an unknown id', () => {
    expect(table.objectAt(7, -0.0001)).toBeNull();
    expect(table.objectAt(7, 0.05)).toBeNull();
    expect(table.objectAt(7, 0.1135)!.cx).toBe(300);
    expect(table.objectAt(7, 0.1145)).toBeNull();
    expect(table.objectAt(8, 0.001)).toBeNull();
    expect(table.objectsAt(0.05)).toEqual([]);
  });

  it('refuses rows out of time order for an object, naming the row', () => {
    expect(() => TrackTable.fromRows([row(0.002, 3, 1, 1), row(0.001, 3, 1, 1)])).toThrow(new RangeError('rows[1]: object 3 at t_s 0.001 does not come after its previous row at t_s 0.002'));
  });
});
