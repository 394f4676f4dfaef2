import type * as NodeFs from 'node:fs';
import type { MessagePort } from 'node:worker_threads';
import type { EventBatch } from '../../core/events/event-batch';
import { decodeTextLines } from '../../core/events/text/text-range-kernel';
import type { TextRangeConfig, TextRangeState } from '../../core/events/text/text-range-types';

/** One byte range of a text event file for a worker to read and decode. */
export interface TextWorkerJob {
  readonly path: string;
  /** Byte range [from, to): from is a line start; to is a line start or the end of the file. */
  readonly from: number;
  readonly to: number;
  readonly config: TextRangeConfig;
  /** Lines are counted from 0 within the range. */
  readonly state: TextRangeState;
  /** The output columns shared by all ranges; this range writes [outStart, outEnd). */
  readonly columns: { readonly t: SharedArrayBuffer; readonly x: SharedArrayBuffer; readonly y: SharedArrayBuffer; readonly p: SharedArrayBuffer };
  readonly outStart: number;
  readonly outEnd: number;
  /** How much of the file to read at a time. */
  readonly pieceBytes: number;
}

export type TextWorkerReply =
  | { readonly kind: 'progress'; readonly bytes: number }
  | {
      readonly kind: 'done';
      readonly state: TextRangeState;
      /** Events written to the shared columns from outStart. */
      readonly inShared: number;
      /** Events that did not fit in the range's share, in order after those. */
      readonly spill: EventBatch | null;
      /** The text of the line with state.fault, for its message. */
      readonly faultText: string;
    }
  | { readonly kind: 'failed'; readonly message: string };

/**
 * The worker's whole program. It refers to nothing outside itself: its collaborators come
 * in as arguments, so textWorkerSource() can ship it as source text, which works the same
 * whether this module runs from TypeScript (the tests) or from the esbuild bundle (where
 * there is no separate worker file to point a Worker at).
 */
export function textWorkerMain(port: MessagePort, fs: typeof NodeFs, decode: typeof decodeTextLines): void {
  function run(job: TextWorkerJob): TextWorkerReply {
    const state = job.state;
    let out: EventBatch = { t: new Float64Array(job.columns.t), x: new Uint16Array(job.columns.x), y: new Uint16Array(job.columns.y), p: new Uint8Array(job.columns.p) };
    let n = job.outStart;
    let outEnd = job.outEnd;
    let inShared = -1; // set once the share is full
    let buffer = new Uint8Array(job.pieceBytes + 1);
    let carry = 0;
    let position = job.from;
    let faultText = '';
    const fd = fs.openSync(job.path, 'r');
    try {
      while (position < job.to) {
        const want = Math.min(job.pieceBytes, job.to - position);
        if (carry + want + 1 > buffer.length) {
          // A line longer than a piece: make room for it.
          const bigger = new Uint8Array(2 * (carry + want + 1));
          bigger.set(buffer.subarray(0, carry));
          buffer = bigger;
        }
        for (let got = 0; got < want; ) {
          const read = fs.readSync(fd, buffer, carry + got, want - got, position + got);
          if (read === 0) throw new Error(`${job.path} became shorter while it was read`);
          got += read;
        }
        position += want;
        let length = carry + want;
        if (position >= job.to && buffer[length - 1] !== 10) buffer[length++] = 10; // a last line without '\n'
        const end = position >= job.to ? length : buffer.lastIndexOf(10, length - 1) + 1;
        let at = 0;
        while (at < end) {
          const before = state.events;
          at = decode(buffer, at, end, job.config, state, out, n, outEnd);
          n += state.events - before;
          if (state.fault || at >= end) break;
          // The share is full: go on in a batch of this worker's own, grown as needed.
          const eventBytes = (position - job.from) / Math.max(1, state.events);
          const more = Math.ceil((job.to - position + end - at) / eventBytes) + 1024;
          const size = inShared < 0 ? more : n + more;
          const grown: EventBatch = { t: new Float64Array(size), x: new Uint16Array(size), y: new Uint16Array(size), p: new Uint8Array(size) };
          if (inShared < 0) {
            inShared = n - job.outStart;
            n = 0;
          } else {
            grown.t.set(out.t);
            grown.x.set(out.x);
            grown.y.set(out.y);
            grown.p.set(out.p);
          }
          out = grown;
          outEnd = size;
        }
        if (state.fault) {
          const lineEnd = buffer.indexOf(10, state.fault.lineByte);
          faultText = new TextDecoder().decode(buffer.subarray(state.fault.lineByte, lineEnd)).replace(/\r$/, '');
          break;
        }
        port.postMessage({ kind: 'progress', bytes: want } satisfies TextWorkerReply);
        carry = length - end;
        buffer.copyWithin(0, end, length);
      }
    } finally {
      fs.closeSync(fd);
    }
    if (inShared < 0) return { kind: 'done', state, inShared: n - job.outStart, spill: null, faultText };
    const spill = { t: out.t.subarray(0, n), x: out.x.subarray(0, n), y: out.y.subarray(0, n), p: out.p.subarray(0, n) };
    return { kind: 'done', state, inShared, spill, faultText };
  }

  port.on('message', (job: TextWorkerJob) => {
    let reply: TextWorkerReply;
    try {
      reply = run(job);
    } catch (error) {
      reply = { kind: 'failed', message: error instanceof Error ? error.message : String(error) };
    }
    const spill = reply.kind === 'done' ? reply.spill : null;
    // The spill's own memory moves to the caller instead of being copied.
    port.postMessage(reply, spill ? [spill.t.buffer, spill.x.buffer, spill.y.buffer, spill.p.buffer].map((b) => b as ArrayBuffer) : []);
  });
}

let source: string | null = null;

/**
 * The worker's program as the source text of an `eval: true` worker (CommonJS, so
 * `require` is there). Function.prototype.toString gives the code as compiled: from
 * vitest's transform in tests, from the bundle in dist/. (A bundle built with esbuild's
 * keepNames would insert calls to its module-level __name helper and break this.)
 */
export function textWorkerSource(): string {
  source ??= `(${textWorkerMain.toString()})(require('node:worker_threads').parentPort, require('node:fs'), ${decodeTextLines.toString()});`;
  return source;
}
