import { lowerBound } from '../events/event-batch';
import type { ObjectKind, TrackRow } from '../sim/track-rows';

/** The six positions of a track row, in sensor pixels, in the order they are stored. */
const FIELDS = ['cx', 'cy', 'x0', 'y0', 'x1', 'y1'] as const;

interface ObjectTrack {
  readonly kind: ObjectKind;
  readonly tS: Float64Array;
  /** FIELDS of row i at [6i, 6i + 6). */
  readonly values: Float64Array;
}

/**
 * A clip's tracked objects (the rows of TRACKS.tsv), asked where each object is at any
 * stimulus time. Between two rows of an object the box is interpolated linearly, as long
 * as they are no further apart than 1.5 times the table's usual row spacing (the median
 * step); a longer gap means the object was off the sensor, and it is absent there.
 */
export class TrackTable {
  readonly objectIds: readonly number[];
  /** First and last row times (s); both 0 for an empty table. */
  readonly startS: number;
  readonly endS: number;
  private readonly maxGapS: number;

  private constructor(private readonly tracks: ReadonlyMap<number, ObjectTrack>) {
    this.objectIds = [...tracks.keys()].sort((a, b) => a - b);
    const all = [...tracks.values()];
    this.startS = all.length ? Math.min(...all.map((t) => t.tS[0]!)) : 0;
    this.endS = all.length ? Math.max(...all.map((t) => t.tS[t.tS.length - 1]!)) : 0;
    this.maxGapS = 1.5 * medianStep(all);
  }

  /**
   * A table from rows whose times increase for each object. `fail` reports a row out of
   * order (the parser names its line); by default it throws a RangeError naming rows[i].
   */
  static fromRows(rows: readonly TrackRow[], fail: (index: number, problem: string) => never = failAtIndex): TrackTable {
    const grouped = new Map<number, { kind: ObjectKind; rows: TrackRow[] }>();
    rows.forEach((row, index) => {
      const group = grouped.get(row.objectId);
      if (!group) return void grouped.set(row.objectId, { kind: row.kind, rows: [row] });
      const last = group.rows[group.rows.length - 1]!;
      if (row.kind !== group.kind) fail(index, `object ${row.objectId} is a ${group.kind} in earlier rows, not a ${row.kind}`);
      if (!(row.tS > last.tS)) fail(index, `object ${row.objectId} at t_s ${row.tS} does not come after its previous row at t_s ${last.tS}`);
      group.rows.push(row);
    });
    const tracks = new Map<number, ObjectTrack>();
    for (const [id, { kind, rows: own }] of grouped) {
      const values = new Float64Array(own.length * FIELDS.length);
      own.forEach((row, i) => FIELDS.forEach((f, j) => (values[i * FIELDS.length + j] = row[f])));
      tracks.set(id, { kind, tS: Float64Array.from(own, (r) => r.tS), values });
    }
    return new TrackTable(tracks);
  }

  /** Where the object is at stimulus time tS, or null when it is not on the sensor then. */
  objectAt(objectId: number, tS: number): TrackRow | null {
    const track = this.tracks.get(objectId);
    if (!track) return null;
    const { tS: times, values } = track;
    const i = lowerBound(times, tS);
    if (i < times.length && times[i] === tS) return row(objectId, track.kind, tS, values, i, i, 0);
    if (i === 0 || i === times.length || times[i]! - times[i - 1]! > this.maxGapS) return null;
    return row(objectId, track.kind, tS, values, i - 1, i, (tS - times[i - 1]!) / (times[i]! - times[i - 1]!));
  }

  /** Every object on the sensor at stimulus time tS, by object id. */
  objectsAt(tS: number): TrackRow[] {
    const present: TrackRow[] = [];
    for (const id of this.objectIds) {
      const r = this.objectAt(id, tS);
      if (r) present.push(r);
    }
    return present;
  }
}

function row(objectId: number, kind: ObjectKind, tS: number, v: Float64Array, a: number, b: number, w: number): TrackRow {
  const at = (j: number) => v[a * 6 + j]! + (v[b * 6 + j]! - v[a * 6 + j]!) * w;
  return { tS, objectId, kind, cx: at(0), cy: at(1), x0: at(2), y0: at(3), x1: at(4), y1: at(5) };
}

/** The median spacing between consecutive rows of the same object; 0 when no object has two rows. */
function medianStep(tracks: readonly ObjectTrack[]): number {
  const steps: number[] = [];
  for (const { tS } of tracks) for (let i = 1; i < tS.length; i++) steps.push(tS[i]! - tS[i - 1]!);
  if (steps.length === 0) return 0;
  steps.sort((a, b) => a - b);
  return steps[steps.length >> 1]!;
}

function failAtIndex(index: number, problem: string): never {
  throw new RangeError(`rows[${index}]: ${problem}`);
}
