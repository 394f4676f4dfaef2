import { describe, expect, it } from 'vitest';
import { decodeFrame, encodeFrame, FrameError, StreamedFrameReader, streamedFramePrefix } from '../../../app/contract/wire';

describe('wire frames', () => {
  it('round-trips JSON and typed arrays, with every attachment 8-byte aligned', () => {
    const xs = new Uint16Array([0, 1, 639, 65535]);
    const ts = new Float64Array([0.5, -1e300, 123456789.125]);
    const odd = new Uint8Array([1, 2, 3]); // 3 bytes: forces padding before the next attachment
    const frame = encodeFrame({ kind: 'event', name: 'onChunk', payload: { label: 'aisle', odd, nested: { xs, ts } } });
    const back = decodeFrame(frame);
    expect(back.kind).toBe('event');
    const payload = (back as { payload: { label: string; odd: Uint8Array; nested: { xs: Uint16Array; ts: Float64Array } } }).payload;
    expect(payload.label).toBe('aisle');
    expect(payload.odd).toEqual(odd);
    expect(payload.nested.xs).toBeInstanceOf(Uint16Array);
    expect(Array.from(payload.nested.xs)).toEqual(Array.from(xs));
    expect(Array.from(payload.nested.ts)).toEqual(Array.from(ts));
    expect(payload.nested.ts.byteOffset % 8).toBe(0);
  });

  it('decodes a frame that starts at an unaligned offset of a larger buffer', () => {
    const frame = encodeFrame({ kind: 'request', id: 7, channel: 'ping', payload: { data: new Float64Array([1, 2]) } });
    const carrier = new Uint8Array(frame.byteLength + 3);
    carrier.set(frame, 3);
    const back = decodeFrame(carrier.subarray(3)) as { payload: { data: Float64Array } };
    expect(Array.from(back.payload.data)).toEqual([1, 2]);
  });

  it.each([
    ['too short', new Uint8Array([1, 0])],
    ['header past the end', new Uint8Array([200, 0, 0, 0, 123])],
    ['header not JSON', new Uint8Array([3, 0, 0, 0, 0x7b, 0x7b, 0x7b])],
  ])('rejects a frame that is %s with a FrameError', (_label, bytes) => {
    expect(() => decodeFrame(bytes)).toThrow(FrameError);
  });

  it('rejects a well-formed frame whose message is not a known kind', () => {
    const header = new TextEncoder().encode('{"message":{"kind":"shout"},"attachments":[]}');
    const frame = new Uint8Array(4 + header.byteLength);
    new DataView(frame.buffer).setUint32(0, header.byteLength, true);
    frame.set(header, 4);
    expect(() => decodeFrame(frame)).toThrow(/message is malformed/);
  });

  it('rejects a reference to an attachment that is not there', () => {
    const header = new TextEncoder().encode('{"message":{"kind":"event","name":"x","payload":{"$attachment":2}},"attachments":[]}');
    const frame = new Uint8Array(4 + header.byteLength);
    new DataView(frame.buffer).setUint32(0, header.byteLength, true);
    frame.set(header, 4);
    expect(() => decodeFrame(frame)).toThrow(/missing attachment 2/);
  });
});

describe('the bulk stream framing', () => {
  it('cuts frames out of a byte stream however it is chunked', () => {
    const messages = [1, 2, 3].map((i) => ({ kind: 'event' as const, name: 'onStageEvents', payload: { i, dt: new Uint32Array(1000).fill(i) } }));
    const bytes = new Uint8Array(
      messages.flatMap((m) => {
        const frame = encodeFrame(m);
        return [...streamedFramePrefix(frame.byteLength), ...frame];
      }),
    );
    for (const step of [1, 7, 64, 4096, bytes.byteLength]) {
      const reader = new StreamedFrameReader();
      const out = [];
      for (let at = 0; at < bytes.byteLength; at += step) out.push(...reader.push(bytes.subarray(at, at + step)));
      expect(out.map((m) => (m as { payload: { i: number } }).payload.i)).toEqual([1, 2, 3]);
      expect(Array.from((out[2] as { payload: { dt: Uint32Array } }).payload.dt.slice(0, 2))).toEqual([3, 3]);
    }
  });
});
