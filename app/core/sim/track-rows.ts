/** The kinds of moving object in the simulated warehouse scene. */
export type ObjectKind = 'forklift' | 'parcel' | 'beacon' | 'person' | 'flickering-light';

/**
 * Where one object is at one instant, in sensor pixels (pixel (x, y) centred on integer
 * (x, y), as event coordinates are): the bounding box of its whole silhouette, soft edge
 * included, clipped to [0, width - 1] x [0, height - 1], and the centre of that box.
 * Occlusion by other objects is not removed.
 */
export interface TrackRow {
  readonly tS: number;
  readonly objectId: number;
  readonly kind: ObjectKind;
  readonly cx: number;
  readonly cy: number;
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/** The header line of TRACKS.tsv, tab-separated. */
export const TRACKS_TSV_HEADER = 't_s\tobject_id\tkind\tcx\tcy\tx0\ty0\tx1\ty1';

/** Decimals written: t_s to the microsecond, coordinates to a hundredth of a pixel. */
export const TRACKS_TSV_DECIMALS = { tS: 6, position: 2 } as const;

/** TSV lines for the rows, each ending in a newline, without the header (for streaming). */
export function formatTrackRows(rows: readonly TrackRow[]): string {
  const { tS, position } = TRACKS_TSV_DECIMALS;
  return rows
    .map((r) => `${r.tS.toFixed(tS)}\t${r.objectId}\t${r.kind}\t${[r.cx, r.cy, r.x0, r.y0, r.x1, r.y1].map((v) => v.toFixed(position)).join('\t')}\n`)
    .join('');
}

/** A whole TRACKS.tsv: the header line, then one line per row. */
export function formatTracksTsv(rows: readonly TrackRow[]): string {
  return `${TRACKS_TSV_HEADER}\n${formatTrackRows(rows)}`;
}
