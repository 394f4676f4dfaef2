import type { EyeSample } from '../gaze/gaze-sample';
import type { GazeRecord } from './records';

/**
 * A gaze record is 88 bytes, little-endian:
 *
 *   offset field
 *        0 trackerTimeS  float64
 *        8 arrivalNs     float64
 *       16 hostNs        float64
 *       24 seq           float64 (0 when absent)
 *       32 left x, 40 left y, 48 left pupil      float64 (0 when absent)
 *       56 right x, 64 right y, 72 right pupil   float64 (0 when absent)
 *       80 flags         uint8: 1 seq present, 2 left present, 4 left valid, 8 left pupil present,
 *                               16 right present, 32 right valid, 64 right pupil present
 *       81 reserved, 7 zero bytes
 *
 * Every number is a float64 because the recorder stores exactly what it was given: feed
 * values arrive as JavaScript numbers (doubles), raw tracker coordinates have no known
 * range, and host times in ns need 53 bits. float32 would halve the size but round the
 * values; at 2000 Hz this layout is 176 kB/s, far below what any disk sustains.
 */
export const GAZE_RECORD_BYTES = 88;

const SEQ = 1;
const LEFT = 2;
const LEFT_VALID = 4;
const LEFT_PUPIL = 8;
const RIGHT = 16;
const RIGHT_VALID = 32;
const RIGHT_PUPIL = 64;

function checkEye(eye: EyeSample | null, name: string): void {
  if (eye === null) return;
  if (typeof eye !== 'object') throw new RangeError(`gaze record: ${name} must be an eye sample or null`);
  if (typeof eye.x !== 'number' || typeof eye.y !== 'number') throw new RangeError(`gaze record: ${name}.x and ${name}.y must be numbers`);
  if (typeof eye.valid !== 'boolean') throw new RangeError(`gaze record: ${name}.valid must be true or false`);
  if (eye.pupil !== null && typeof eye.pupil !== 'number') throw new RangeError(`gaze record: ${name}.pupil must be a number or null`);
}

const finite = (value: unknown): boolean => typeof value === 'number' && Number.isFinite(value);

/** Throws a RangeError naming the field when a record cannot be stored as given. */
export function checkGazeRecord(r: GazeRecord): void {
  if (!finite(r.trackerTimeS)) throw new RangeError(`gaze record: trackerTimeS must be a finite number, got ${r.trackerTimeS}`);
  if (!finite(r.arrivalNs)) throw new RangeError(`gaze record: arrivalNs must be a finite number, got ${r.arrivalNs}`);
  if (!finite(r.hostNs)) throw new RangeError(`gaze record: hostNs must be a finite number, got ${r.hostNs}`);
  if (r.seq !== null && !finite(r.seq)) throw new RangeError(`gaze record: seq must be a finite number or null, got ${r.seq}`);
  checkEye(r.left, 'left');
  checkEye(r.right, 'right');
}

function eyeFlags(eye: EyeSample | null, present: number, valid: number, pupil: number): number {
  if (eye === null) return 0;
  return present | (eye.valid ? valid : 0) | (eye.pupil !== null ? pupil : 0);
}

export function writeGazeRecord(view: DataView, at: number, r: GazeRecord): void {
  view.setFloat64(at, r.trackerTimeS, true);
  view.setFloat64(at + 8, r.arrivalNs, true);
  view.setFloat64(at + 16, r.hostNs, true);
  view.setFloat64(at + 24, r.seq ?? 0, true);
  view.setFloat64(at + 32, r.left?.x ?? 0, true);
  view.setFloat64(at + 40, r.left?.y ?? 0, true);
  view.setFloat64(at + 48, r.left?.pupil ?? 0, true);
  view.setFloat64(at + 56, r.right?.x ?? 0, true);
  view.setFloat64(at + 64, r.right?.y ?? 0, true);
  view.setFloat64(at + 72, r.right?.pupil ?? 0, true);
  const flags = (r.seq !== null ? SEQ : 0) | eyeFlags(r.left, LEFT, LEFT_VALID, LEFT_PUPIL) | eyeFlags(r.right, RIGHT, RIGHT_VALID, RIGHT_PUPIL);
  view.setUint32(at + 80, flags, true);
  view.setUint32(at + 84, 0, true);
}

function readEye(view: DataView, at: number, flags: number, present: number, valid: number, pupil: number): EyeSample | null {
  if (!(flags & present)) return null;
  return { x: view.getFloat64(at, true), y: view.getFloat64(at + 8, true), valid: (flags & valid) !== 0, pupil: flags & pupil ? view.getFloat64(at + 16, true) : null };
}

export function readGazeRecord(view: DataView, at: number): GazeRecord {
  const flags = view.getUint8(at + 80);
  return {
    seq: flags & SEQ ? view.getFloat64(at + 24, true) : null,
    trackerTimeS: view.getFloat64(at, true),
    arrivalNs: view.getFloat64(at + 8, true),
    hostNs: view.getFloat64(at + 16, true),
    left: readEye(view, at + 32, flags, LEFT, LEFT_VALID, LEFT_PUPIL),
    right: readEye(view, at + 56, flags, RIGHT, RIGHT_VALID, RIGHT_PUPIL),
  };
}

/** The records of a gaze chunk's payload; throws an Error saying what is wrong with its size. */
export function decodeGazePayload(payload: Uint8Array, count: number): GazeRecord[] {
  if (payload.length !== count * GAZE_RECORD_BYTES) throw new Error(`gaze payload is ${payload.length} bytes, expected ${count} records of ${GAZE_RECORD_BYTES}`);
  const view = new DataView(payload.buffer, payload.byteOffset, payload.length);
  const records: GazeRecord[] = new Array(count);
  for (let i = 0; i < count; i++) records[i] = readGazeRecord(view, i * GAZE_RECORD_BYTES);
  return records;
}
