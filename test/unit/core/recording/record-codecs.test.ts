import { describe, expect, it } from 'vitest';
import { CHUNK_HEADER_BYTES, parseChunkHeader } from '../../../../app/core/recording/chunk-format';
import { decodeFramePayload } from '../../../../app/core/recording/frame-codec';
import { FrameChunkBuilder } from '../../../../app/core/recording/frame-chunk-builder';
import { decodeGazePayload, GAZE_RECORD_BYTES } from '../../../../app/core/recording/gaze-codec';
import { GazeChunkBuilder } from '../../../../app/core/recording/gaze-chunk-builder';
import { decodeMessagePayload } from '../../../../app/core/recording/message-codec';
import { MessageChunkBuilder } from '../../../../app/core/recording/message-chunk-builder';
import type { FrameRecord, GazeRecord, MessageRecord } from '../../../../app/core/recording/records';

const header = (chunk: Uint8Array) => {
  const h = parseChunkHeader(chunk.subarray(0, CHUNK_HEADER_BYTES));
  if (typeof h === 'string') throw new Error(h);
  return h;
};

const gaze: GazeRecord[] = [
  { seq: 0, trackerTimeS: 1_700_000_000.123456, arrivalNs: 5e9 + 1, hostNs: 5e9 - 250_000, left: { x: 960.25, y: 540.125, valid: true, pupil: 3.21 }, right: { x: 961, y: 541, valid: true, pupil: 3.3 } },
  // A blink: both eyes sent invalid, with NaN coordinates as the feed delivers them.
  { seq: 1, trackerTimeS: 1_700_000_000.123956, arrivalNs: 5.0005e9, hostNs: 5.0004e9, left: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null }, right: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null } },
  // One eye recorded, no sequence number, a raw tracker coordinate with no screen meaning.
  { seq: null, trackerTimeS: 0.1 + 0.2, arrivalNs: 6e9, hostNs: 6e9, left: null, right: { x: -12345.678901234567, y: 1e-300, valid: true, pupil: null } },
];

describe('gaze chunk', () => {
  it('gives back exactly the records appended (every float64 bit, NaN, null eyes and pupils)', () => {
    const b = new GazeChunkBuilder();
    gaze.forEach((r) => b.append(r));
    expect(b.payloadBytes).toBe(3 * GAZE_RECORD_BYTES);
    const chunk = b.take(9);
    const h = header(chunk);
    expect(h).toMatchObject({ stream: 'gaze', seq: 9, count: 3, minHostNs: 5e9 - 250_000, maxHostNs: 6e9 });
    expect(decodeGazePayload(chunk.subarray(CHUNK_HEADER_BYTES), 3)).toEqual(gaze);
    expect(b.count).toBe(0); // take starts a fresh chunk
  });

  it('keeps every record when the chunk grows past its first buffer', () => {
    const b = new GazeChunkBuilder();
    const many = Array.from({ length: 1000 }, (_, i) => ({ ...gaze[i % 3]!, seq: i }));
    many.forEach((r) => b.append(r));
    expect(decodeGazePayload(b.take(0).subarray(CHUNK_HEADER_BYTES), 1000)).toEqual(many);
  });

  it('refuses a record that cannot be stored as given, naming the field', () => {
    const b = new GazeChunkBuilder();
    expect(() => b.append({ ...gaze[0]!, trackerTimeS: Number.NaN })).toThrow(/trackerTimeS must be a finite number/);
    expect(() => b.append({ ...gaze[0]!, hostNs: Infinity })).toThrow(/hostNs/);
    expect(() => b.append({ ...gaze[0]!, left: { x: 1, y: 2, valid: 'yes' as unknown as boolean, pupil: null } })).toThrow(/left.valid must be true or false/);
    expect(b.count).toBe(0);
  });

  it('says what is wrong with a payload of the wrong size', () => {
    expect(() => decodeGazePayload(new Uint8Array(100), 1)).toThrow(/gaze payload is 100 bytes, expected 1 records of 88/);
  });
});

describe('frame chunk', () => {
  const frames: FrameRecord[] = [
    { frame: 0, stageTimeMs: 1000.5, hostNs: 7e9, clip: null, stimulusUs: null, eventsDrawn: 0, late: false, photodiode: null },
    { frame: 1, stageTimeMs: 1017.1666, hostNs: 7.0166e9, clip: 'aisle-3 forklift', stimulusUs: 1_000_000.5, eventsDrawn: 331_000, late: false, photodiode: 1 },
    { frame: 2, stageTimeMs: 1050.5, hostNs: 7.05e9, clip: 'conveyor ✓ parcels', stimulusUs: 1_033_333.25, eventsDrawn: 12, late: true, photodiode: 0 },
    { frame: 3, stageTimeMs: 1067.1, hostNs: 7.066e9, clip: 'aisle-3 forklift', stimulusUs: 0, eventsDrawn: 1, late: false, photodiode: 0 },
  ];

  it('gives back exactly the frames appended, clip names through the chunk table', () => {
    const b = new FrameChunkBuilder();
    frames.forEach((f) => b.append(f));
    const chunk = b.take(0);
    expect(header(chunk)).toMatchObject({ stream: 'frames', count: 4, minHostNs: 7e9, maxHostNs: 7.066e9 });
    expect(decodeFramePayload(chunk.subarray(CHUNK_HEADER_BYTES), 4)).toEqual(frames);
    // Each chunk has its own table: a second chunk decodes alone.
    b.append(frames[2]!);
    expect(decodeFramePayload(b.take(1).subarray(CHUNK_HEADER_BYTES), 1)).toEqual([frames[2]]);
  });

  it('keeps every frame and clip name when the chunk grows past its first buffer', () => {
    const b = new FrameChunkBuilder();
    const many = Array.from({ length: 500 }, (_, i) => ({ ...frames[i % 4]!, frame: i, clip: i % 4 === 0 ? null : `clip ${i % 97}` }));
    many.forEach((f) => b.append(f));
    expect(decodeFramePayload(b.take(0).subarray(CHUNK_HEADER_BYTES), 500)).toEqual(many);
  });

  it('refuses bad frames, naming the field', () => {
    const b = new FrameChunkBuilder();
    expect(() => b.append({ ...frames[1]!, photodiode: 2 as 0 })).toThrow(/photodiode must be 0, 1 or null/);
    expect(() => b.append({ ...frames[1]!, stimulusUs: Number.NaN })).toThrow(/stimulusUs/);
  });
});

describe('message chunk', () => {
  const messages: MessageRecord[] = [
    { hostNs: 1e9, kind: 'clip_start', data: { clip: 'beacon', speed: 0.5, placement: { mode: 'fit', scale: 2.25, left: 240, top: 0, sensor: { width: 640, height: 480 } } } },
    { hostNs: 1.5e9, kind: 'operator_mark', data: { note: 'participant blinked a lot\nline two', tags: ['a', 'b'], extra: null } },
  ];

  it('gives back exactly the messages appended, as UTF-8 JSON lines', () => {
    const b = new MessageChunkBuilder();
    messages.forEach((m) => b.append(m));
    const chunk = b.take(3);
    const payload = chunk.subarray(CHUNK_HEADER_BYTES);
    expect(new TextDecoder().decode(payload).split('\n')).toHaveLength(3); // two lines and the final newline
    expect(b.payloadBytes).toBe(0);
    expect(decodeMessagePayload(payload, 2)).toEqual(messages);
  });

  it('refuses data that JSON would not give back unchanged, naming the path', () => {
    const b = new MessageChunkBuilder();
    expect(() => b.append({ hostNs: 0, kind: 'clip_start', data: { placement: { scale: Number.NaN } } })).toThrow(/data.placement.scale must be a finite number/);
    expect(() => b.append({ hostNs: 0, kind: 'mark', data: { when: new Date(0) } })).toThrow(/data.when must be a plain object/);
    expect(() => b.append({ hostNs: 0, kind: 'mark', data: { list: [1, undefined] } })).toThrow(/data.list\[1\] cannot be stored as JSON/);
    expect(() => b.append({ hostNs: 0, kind: '', data: {} })).toThrow(/kind must be a non-empty string/);
    expect(b.count).toBe(0);
  });
});
