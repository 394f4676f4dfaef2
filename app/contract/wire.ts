import { z } from 'zod';
import { failureCodes } from './result';

/**
 * The messages that carry the contract over a byte stream (the browser-mode WebSocket).
 * Electron's IPC carries the same objects by structured clone and needs none of this.
 *
 * Frame layout (all little-endian):
 *   u32 header length H | H bytes of UTF-8 JSON header | zero padding to a multiple of 8 |
 *   attachments, each starting on a multiple of 8
 * The header is `{ "message": ..., "attachments": [{ "type", "offset", "bytes" }] }`; inside
 * `message` every typed array is replaced by `{ "$attachment": index }`. Aligned attachments
 * let the receiver view them as typed arrays without copying.
 */

const failureSchema = z.object({
  ok: z.literal(false),
  code: z.enum(failureCodes),
  message: z.string(),
  path: z.string().optional(),
});

export const wireMessage = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('request'), id: z.number().int().nonnegative(), channel: z.string(), payload: z.unknown() }),
  z.object({
    kind: z.literal('response'),
    id: z.number().int().nonnegative(),
    result: z.union([z.object({ ok: z.literal(true), value: z.unknown() }), failureSchema]),
  }),
  z.object({ kind: z.literal('event'), name: z.string(), payload: z.unknown() }),
  /** The host could not read a frame at all, so there is no request id to answer. */
  z.object({ kind: z.literal('rejected'), failure: failureSchema }),
  /** The host's first message on a connection: its id, to open the bulk stream with. */
  z.object({ kind: z.literal('welcome'), connectionId: z.string() }),
]);

export type WireMessage = z.infer<typeof wireMessage>;

const typedArrayConstructors = {
  Uint8Array,
  Int8Array,
  Uint16Array,
  Int16Array,
  Uint32Array,
  Int32Array,
  Float32Array,
  Float64Array,
  BigInt64Array,
  BigUint64Array,
} as const;

type TypedArrayName = keyof typeof typedArrayConstructors;
type AnyTypedArray = InstanceType<(typeof typedArrayConstructors)[TypedArrayName]>;

interface AttachmentEntry {
  type: TypedArrayName;
  offset: number;
  bytes: number;
}

const headerSchema = z.object({
  message: z.unknown(),
  attachments: z.array(
    z.object({
      type: z.enum(Object.keys(typedArrayConstructors) as [TypedArrayName, ...TypedArrayName[]]),
      offset: z.number().int().nonnegative(),
      bytes: z.number().int().nonnegative(),
    }),
  ),
});

function typedArrayName(value: unknown): TypedArrayName | null {
  if (!ArrayBuffer.isView(value) || value instanceof DataView) return null;
  const name = value.constructor.name;
  return name in typedArrayConstructors ? (name as TypedArrayName) : null;
}

const align8 = (n: number): number => (n + 7) & ~7;
const utf8 = new TextEncoder();
const utf8Decoder = new TextDecoder('utf-8', { fatal: true });

export function encodeFrame(message: WireMessage): Uint8Array {
  const parts: AnyTypedArray[] = [];
  const entries: AttachmentEntry[] = [];
  let cursor = 0;
  const replacer = (_key: string, value: unknown): unknown => {
    const type = typedArrayName(value);
    if (type === null) return value;
    const view = value as AnyTypedArray;
    entries.push({ type, offset: cursor, bytes: view.byteLength });
    parts.push(view);
    cursor = align8(cursor + view.byteLength);
    return { $attachment: entries.length - 1 };
  };
  const messageJson = JSON.stringify(message, replacer);
  const header = utf8.encode(`{"message":${messageJson},"attachments":${JSON.stringify(entries)}}`);
  const bodyStart = align8(4 + header.byteLength);
  const frame = new Uint8Array(bodyStart + cursor);
  new DataView(frame.buffer).setUint32(0, header.byteLength, true);
  frame.set(header, 4);
  parts.forEach((part, i) => {
    const entry = entries[i]!;
    frame.set(new Uint8Array(part.buffer, part.byteOffset, part.byteLength), bodyStart + entry.offset);
  });
  return frame;
}

export class FrameError extends Error {
  override name = 'FrameError';
}

export function decodeFrame(frame: Uint8Array): WireMessage {
  if (frame.byteLength < 4) throw new FrameError(`frame of ${frame.byteLength} bytes is shorter than its 4-byte header length`);
  const headerLength = new DataView(frame.buffer, frame.byteOffset, frame.byteLength).getUint32(0, true);
  if (4 + headerLength > frame.byteLength) throw new FrameError(`header length ${headerLength} runs past the frame's ${frame.byteLength} bytes`);
  let headerJson: unknown;
  try {
    headerJson = JSON.parse(utf8Decoder.decode(frame.subarray(4, 4 + headerLength)));
  } catch (error) {
    throw new FrameError(`header is not UTF-8 JSON: ${(error as Error).message}`);
  }
  const header = headerSchema.safeParse(headerJson);
  if (!header.success) throw new FrameError(`header is malformed: ${header.error.issues[0]?.message ?? 'unknown'}`);
  const bodyStart = align8(4 + headerLength);
  // Copy into a fresh aligned buffer only when the frame itself is misaligned.
  const body =
    (frame.byteOffset + bodyStart) % 8 === 0
      ? { buffer: frame.buffer, base: frame.byteOffset + bodyStart }
      : { buffer: frame.slice(bodyStart).buffer, base: 0 };
  const views = header.data.attachments.map((entry, index) => {
    if (bodyStart + entry.offset + entry.bytes > frame.byteLength) {
      throw new FrameError(`attachment ${index} runs past the end of the frame`);
    }
    const Ctor = typedArrayConstructors[entry.type];
    if (entry.bytes % Ctor.BYTES_PER_ELEMENT !== 0) throw new FrameError(`attachment ${index} is not a whole number of ${entry.type} elements`);
    return new Ctor(body.buffer as ArrayBuffer, body.base + entry.offset, entry.bytes / Ctor.BYTES_PER_ELEMENT);
  });
  const message = restoreAttachments(header.data.message, views);
  const parsed = wireMessage.safeParse(message);
  if (!parsed.success) throw new FrameError(`message is malformed: ${parsed.error.issues[0]?.message ?? 'unknown'}`);
  return parsed.data;
}

function restoreAttachments(value: unknown, views: AnyTypedArray[]): unknown {
  if (Array.isArray(value)) return value.map((item) => restoreAttachments(item, views));
  if (value === null || typeof value !== 'object') return value;
  const record = value as Record<string, unknown>;
  const keys = Object.keys(record);
  if (keys.length === 1 && keys[0] === '$attachment' && typeof record.$attachment === 'number') {
    const view = views[record.$attachment];
    if (!view) throw new FrameError(`reference to missing attachment ${record.$attachment}`);
    return view;
  }
  const out: Record<string, unknown> = {};
  for (const key of keys) out[key] = restoreAttachments(record[key], views);
  return out;
}

/**
 * The bulk stream is a sequence of frames, each preceded by 8 bytes: its length (u32,
 * little-endian) and 4 zero bytes that keep the frame 8-aligned for its attachments. A
 * reader cuts frames out of the byte stream whatever its chunking.
 */
export function streamedFramePrefix(frameBytes: number): Uint8Array {
  const prefix = new Uint8Array(8);
  new DataView(prefix.buffer).setUint32(0, frameBytes, true);
  return prefix;
}

/** Cuts length-prefixed frames out of a byte stream as it arrives, copying each byte once. */
export class StreamedFrameReader {
  private readonly parts: Uint8Array[] = [];
  private buffered = 0;

  push(bytes: Uint8Array): WireMessage[] {
    this.parts.push(bytes);
    this.buffered += bytes.byteLength;
    const out: WireMessage[] = [];
    for (;;) {
      if (this.buffered < 8) break;
      const length = new DataView(this.peek(8).buffer).getUint32(0, true);
      if (this.buffered < 8 + length) break;
      this.take(8);
      out.push(decodeFrame(this.take(length)));
    }
    return out;
  }

  /** The first n buffered bytes, copied (the parts are left alone). */
  private peek(n: number): Uint8Array {
    const out = new Uint8Array(n);
    let filled = 0;
    for (const part of this.parts) {
      const use = Math.min(part.byteLength, n - filled);
      out.set(part.subarray(0, use), filled);
      filled += use;
      if (filled === n) break;
    }
    return out;
  }

  /** Removes and returns the first n buffered bytes in a fresh (aligned) buffer. */
  private take(n: number): Uint8Array {
    const out = new Uint8Array(n);
    let filled = 0;
    while (filled < n) {
      const part = this.parts[0]!;
      const use = Math.min(part.byteLength, n - filled);
      out.set(part.subarray(0, use), filled);
      filled += use;
      if (use === part.byteLength) this.parts.shift();
      else this.parts[0] = part.subarray(use);
    }
    this.buffered -= n;
    return out;
  }
}
