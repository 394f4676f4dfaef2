import { describe, expect, it } from 'vitest';
import { EventFormatError } from '../../../../app/core/events/event-format-error';
import { TextEventDecoder } from '../../../../app/core/events/text/text-event-decoder';

// Chunks may be cut anywhere (inside a number, between '\r' and '\n', inside the header)
// and the decode must not change (an invariant of streaming, common practice, no source).

const CSV = '# width=640 height=480\r\nx , t_ns,y,p\r\n\r\n12,1000017,40,1\r\n639,1000017,479,0\n  \n0,1000250000,0,1\r\n7, 2000000000 ,8,0';
const SECONDS = '0.000000001 33 39 -1\n\n0.5\t34\t39\t1\r\n  12.345678901   35  40  -1  \r\n13 1 2 1';
const FAULTY = 't,x,y,p\n1000,1,1,1\n\n1000,2,2,0\r\n999,3,3,1\n1001,4,4,1\n';

function decode(chunks: readonly Uint8Array[]): string {
  const decoder = new TextEventDecoder({ file: 'aisle.csv' });
  const events: number[][] = [];
  const take = (batch: { t: Float64Array; x: Uint16Array; y: Uint16Array; p: Uint8Array }) => batch.t.forEach((t, i) => events.push([t, batch.x[i]!, batch.y[i]!, batch.p[i]!]));
  try {
    for (const chunk of chunks) take(decoder.push(chunk));
    take(decoder.end());
  } catch (error) {
    if (error instanceof EventFormatError) return error.message;
    throw error;
  }
  const { format, resolution, declaredSensor, extent, eventCount, lineCount, bytesRead } = decoder;
  return JSON.stringify({ events, format, resolution, declaredSensor, extent, eventCount, lineCount, bytesRead });
}

describe.each([
  ['CSV with a comment, a unit and CRLF', CSV],
  ['headerless seconds', SECONDS],
  ['a file with a decrease', FAULTY],
])('chunk splits of %s', (_, text) => {
  const bytes = new TextEncoder().encode(text);
  const whole = decode([bytes]);

  it('decodes as it should in one piece', () => {
    expect(whole).toMatch(text === FAULTY ? /line 5: timestamp 999 is earlier than 1000 on line 4/ : /"eventCount":4/);
  });

  it('decodes the same when split at every byte position', () => {
    for (let cut = 0; cut <= bytes.length; cut++) expect(decode([bytes.subarray(0, cut), bytes.subarray(cut)]), `cut at ${cut}`).toBe(whole);
  });

  it('decodes the same when split at every pair of positions', () => {
    for (let a = 0; a <= bytes.length; a++) {
      for (let b = a; b <= bytes.length; b += 3) expect(decode([bytes.subarray(0, a), bytes.subarray(a, b), bytes.subarray(b)]), `cuts at ${a}, ${b}`).toBe(whole);
    }
  });

  it('decodes the same one byte at a time', () => {
    expect(decode(Array.from(bytes, (_, i) => bytes.subarray(i, i + 1)))).toBe(whole);
  });
});
