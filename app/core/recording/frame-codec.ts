import type { FrameRecord } from './records';

/**
 * A frame record is 48 bytes, little-endian:
 *
 *   offset field
 *        0 stageTimeMs  float64
 *        8 hostNs       float64
 *       16 frame        float64
 *       24 stimulusUs   float64 (0 when null)
 *       32 eventsDrawn  float64
 *       40 clip         uint16: index into the chunk's clip table, 0xFFFF for none
 *       42 flags        uint8: 1 late, 2 stimulus time present, 4 photodiode patch on, 8 patch white
 *       43 reserved, 5 zero bytes
 *
 * After the records, the chunk's clip table: a uint16 entry count, then per entry a uint16
 * byte length and the clip name in UTF-8. Each chunk carries its own table, so every chunk
 * decodes on its own even when its neighbours are damaged.
 */
export const FRAME_RECORD_BYTES = 48;
export const NO_CLIP = 0xffff;

const LATE = 1;
const STIMULUS = 2;
const PATCH = 4;
const PATCH_WHITE = 8;

const finite = (value: unknown): boolean => typeof value === 'number' && Number.isFinite(value);

export function checkFrameRecord(r: FrameRecord): void {
  for (const key of ['frame', 'stageTimeMs', 'hostNs', 'eventsDrawn'] as const) {
    if (!finite(r[key])) throw new RangeError(`frame record: ${key} must be a finite number, got ${r[key]}`);
  }
  if (r.stimulusUs !== null && !finite(r.stimulusUs)) throw new RangeError(`frame record: stimulusUs must be a finite number or null, got ${r.stimulusUs}`);
  if (r.clip !== null && typeof r.clip !== 'string') throw new RangeError('frame record: clip must be a string or null');
  if (typeof r.late !== 'boolean') throw new RangeError('frame record: late must be true or false');
  if (r.photodiode !== null && r.photodiode !== 0 && r.photodiode !== 1) throw new RangeError(`frame record: photodiode must be 0, 1 or null, got ${r.photodiode}`);
}

export function writeFrameRecord(view: DataView, at: number, r: FrameRecord, clipIndex: number): void {
  view.setFloat64(at, r.stageTimeMs, true);
  view.setFloat64(at + 8, r.hostNs, true);
  view.setFloat64(at + 16, r.frame, true);
  view.setFloat64(at + 24, r.stimulusUs ?? 0, true);
  view.setFloat64(at + 32, r.eventsDrawn, true);
  view.setUint16(at + 40, clipIndex, true);
  const flags = (r.late ? LATE : 0) | (r.stimulusUs !== null ? STIMULUS : 0) | (r.photodiode !== null ? PATCH : 0) | (r.photodiode === 1 ? PATCH_WHITE : 0);
  view.setUint8(at + 42, flags);
  view.setUint8(at + 43, 0);
  view.setUint32(at + 44, 0, true);
}

const encoder = new TextEncoder();
const decoder = new TextDecoder('utf-8', { fatal: true });

/** Bytes of a clip table for `clips` in index order. */
export function encodeClipTable(clips: readonly string[]): Uint8Array[] {
  const parts = [Uint8Array.of(clips.length & 255, clips.length >>> 8)];
  for (const clip of clips) {
    const name = encoder.encode(clip);
    if (name.length > 0xffff) throw new RangeError(`frame record: clip name must be at most 65535 bytes of UTF-8, got ${name.length}`);
    parts.push(Uint8Array.of(name.length & 255, name.length >>> 8), name);
  }
  return parts;
}

function decodeClipTable(bytes: Uint8Array): string[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  if (bytes.length < 2) throw new Error('frame payload has no clip table');
  const count = view.getUint16(0, true);
  const clips: string[] = [];
  let at = 2;
  for (let i = 0; i < count; i++) {
    if (at + 2 > bytes.length) throw new Error(`frame clip table ends inside entry ${i}`);
    const length = view.getUint16(at, true);
    if (at + 2 + length > bytes.length) throw new Error(`frame clip table entry ${i} runs past the payload`);
    clips.push(decoder.decode(bytes.subarray(at + 2, at + 2 + length)));
    at += 2 + length;
  }
  if (at !== bytes.length) throw new Error(`frame payload has ${bytes.length - at} bytes after its clip table`);
  return clips;
}

export function decodeFramePayload(payload: Uint8Array, count: number): FrameRecord[] {
  const recordBytes = count * FRAME_RECORD_BYTES;
  if (payload.length < recordBytes) throw new Error(`frame payload is ${payload.length} bytes, too short for ${count} records of ${FRAME_RECORD_BYTES}`);
  const clips = decodeClipTable(payload.subarray(recordBytes));
  const view = new DataView(payload.buffer, payload.byteOffset, recordBytes);
  const records: FrameRecord[] = new Array(count);
  for (let i = 0; i < count; i++) {
    const at = i * FRAME_RECORD_BYTES;
    const clipIndex = view.getUint16(at + 40, true);
    if (clipIndex !== NO_CLIP && clipIndex >= clips.length) throw new Error(`frame record ${i} names clip ${clipIndex} of a ${clips.length}-entry table`);
    const flags = view.getUint8(at + 42);
    records[i] = {
      frame: view.getFloat64(at + 16, true),
      stageTimeMs: view.getFloat64(at, true),
      hostNs: view.getFloat64(at + 8, true),
      clip: clipIndex === NO_CLIP ? null : clips[clipIndex]!,
      stimulusUs: flags & STIMULUS ? view.getFloat64(at + 24, true) : null,
      eventsDrawn: view.getFloat64(at + 32, true),
      late: (flags & LATE) !== 0,
      photodiode: flags & PATCH ? (flags & PATCH_WHITE ? 1 : 0) : null,
    };
  }
  return records;
}
