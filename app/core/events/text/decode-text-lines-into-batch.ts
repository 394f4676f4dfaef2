import { allocateBatch, sliceBatch, type EventBatch } from '../event-batch';
import { decodeTextLines } from './text-range-kernel';
import type { TextRangeConfig, TextRangeState } from './text-range-types';

/** Events that `bytes` from..to of about this many lines will need room for. */
function estimateEventCount(bytes: Uint8Array, from: number, to: number): number {
  const sampleEnd = Math.min(to, from + 4096);
  let lines = 0;
  for (let k = from; k < sampleEnd; k++) if (bytes[k] === 10) lines++;
  const meanLineBytes = lines > 0 ? (sampleEnd - from) / lines : 16;
  return Math.ceil(((to - from) / meanLineBytes) * 1.05) + 16;
}

/**
 * Decodes the complete lines of bytes[from, to) into a new batch, growing it if the line
 * length estimate was short. Stops at a fault, which is left in state.fault.
 */
export function decodeTextLinesIntoBatch(bytes: Uint8Array, from: number, to: number, config: TextRangeConfig, state: TextRangeState): EventBatch {
  let out = allocateBatch(estimateEventCount(bytes, from, to));
  let n = 0;
  let at = from;
  for (;;) {
    const before = state.events;
    at = decodeTextLines(bytes, at, to, config, state, out, n, out.t.length);
    n += state.events - before;
    if (state.fault || at >= to) break;
    const grown = allocateBatch(n + estimateEventCount(bytes, at, to));
    grown.t.set(out.t);
    grown.x.set(out.x);
    grown.y.set(out.y);
    grown.p.set(out.p);
    out = grown;
  }
  return n === out.t.length ? out : sliceBatch(out, 0, n);
}
