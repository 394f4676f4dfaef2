import { describe, expect, it } from 'vitest';
import { concatBatches, type EventBatch } from '../../../../app/core/events/event-batch';
import { EventFormatError } from '../../../../app/core/events/event-format-error';
import { decodeTextLinesIntoBatch } from '../../../../app/core/events/text/decode-text-lines-into-batch';
import { mergeTextRanges } from '../../../../app/core/events/text/merge-text-ranges';
import { TextEventDecoder } from '../../../../app/core/events/text/text-event-decoder';
import { lineTextAt, textFaultError } from '../../../../app/core/events/text/text-fault-error';
import { readTextLayout, type TextLayout } from '../../../../app/core/events/text/text-layout';
import { textRangeConfig } from '../../../../app/core/events/text/text-range-config';
import { newTextRangeState } from '../../../../app/core/events/text/text-range-types';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

// Decoding a file as separately decoded line ranges, then merging them, must say exactly
// what one decoder reading the whole file says: the same events, line count and extent,
// or the same error on the same line (the invariant the worker decode relies on; common
// practice, no source).

const describeBatch = (batch: EventBatch, lines: number, width: number, height: number) =>
  JSON.stringify({ t: Array.from(batch.t), x: Array.from(batch.x), y: Array.from(batch.y), p: Array.from(batch.p), lines, width, height });

function whole(text: string): string {
  const decoder = new TextEventDecoder({ file: 'aisle.csv' });
  try {
    const batch = concatBatches([decoder.push(new TextEncoder().encode(text)), decoder.end()]);
    return describeBatch(batch, decoder.lineCount, decoder.extent.width, decoder.extent.height);
  } catch (error) {
    if (error instanceof EventFormatError) return error.message;
    throw error;
  }
}

function inRanges(text: string, starts: readonly number[]): string {
  const bytes = new TextEncoder().encode(text.endsWith('\n') ? text : `${text}\n`);
  const layout = readTextLayout(bytes, true, { file: 'aisle.csv' }) as TextLayout;
  const config = textRangeConfig(layout, false);
  const cuts = [layout.bodyByte, ...starts.filter((s) => s > layout.bodyByte && s < bytes.length), bytes.length];
  const states = cuts.slice(1).map(() => newTextRangeState(0));
  const texts: string[] = [];
  const batches = cuts.slice(1).map((to, k) => {
    const batch = decodeTextLinesIntoBatch(bytes, cuts[k]!, to, config, states[k]!);
    texts.push(states[k]!.fault ? lineTextAt(bytes, states[k]!.fault!.lineByte) : '');
    return batch;
  });
  const merged = mergeTextRanges(states, layout.bodyLine, config);
  if (merged.fault) return textFaultError('aisle.csv', layout, merged.fault, merged.faultRange === null ? '' : texts[merged.faultRange]!).message;
  return describeBatch(concatBatches(batches), merged.lines, merged.maxX + 1, merged.maxY + 1);
}

/** Line starts of a text, as byte offsets. */
const lineStarts = (text: string) => [...new TextEncoder().encode(text)].flatMap((b, i) => (b === 10 ? [i + 1] : []));

describe('merging separately decoded line ranges', () => {
  const rng = new Xoshiro128(9);
  const events = Array.from({ length: 60 }, (_, k) => `${1000 + 7 * k},${k % 13},${k % 7},${k % 2}`);

  it.each([
    ['a good file', ['# width=20 height=10', 't,x,y,p', ...events].join('\n')],
    ['blank lines and CRLF', ['t,x,y,p', '', ...events.map((e, k) => (k % 5 === 0 ? `${e}\r\n` : e))].join('\n')],
    ['a decrease', ['t,x,y,p', ...events.slice(0, 30), '999,1,1,1', ...events.slice(30)].join('\n')],
    ['OFF as 0, later as -1', ['t,x,y,p', ...events.slice(0, 40), '9999,1,1,-1'].join('\n')],
    ['OFF as -1, later as 0', ['1.0 1 1 -1', '2.0 2 2 1', '', '3.0 3 3 -1', '4.0 4 4 0'].join('\n')],
    ['a malformed line', ['t,x,y,p', ...events.slice(0, 20), '1,2', ...events.slice(20)].join('\n')],
    ['a decrease after a bad line', ['t,x,y,p', ...events.slice(0, 20), '2000,x,1,1', '1,1,1,1'].join('\n')],
  ])('%s', (_, text) => {
    const expected = whole(text);
    const starts = lineStarts(text);
    for (const start of starts) expect(inRanges(text, [start]), `one cut at ${start}`).toBe(expected);
    for (let round = 0; round < 60; round++) {
      const cuts = Array.from({ length: 1 + rng.nextInt(6) }, () => starts[rng.nextInt(starts.length)]!).sort((a, b) => a - b);
      expect(inRanges(text, [...new Set(cuts)]), `cuts at ${cuts}`).toBe(expected);
    }
  });

  it('each range on its own would have missed the boundary faults', () => {
    // A cut just before the decrease: neither range has a fault of its own.
    const text = ['t,x,y,p', '5,1,1,1', '4,1,1,1'].join('\n');
    expect(inRanges(text, [lineStarts(text)[1]!])).toBe('aisle.csv line 3: timestamp 4 is earlier than 5 on line 2 (use --sort to reorder)');
  });
});
