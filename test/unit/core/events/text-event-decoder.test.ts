import { describe, expect, it } from 'vitest';
import { concatBatches } from '../../../../app/core/events/event-batch';
import { TextEventDecoder, type TextDecoderOptions } from '../../../../app/core/events/text/text-event-decoder';

// The formats come from the issue (common practice, no source); the headerless seconds
// form is the one open event-camera datasets ship as events.txt, 'timestamp x y
// polarity' with t in seconds to 9 decimals (Mueggler et al. 2017, "The event-camera
// dataset and simulator", IJRR 36(2); format from memory).

function decode(text: string, options: Partial<TextDecoderOptions> = {}) {
  const decoder = new TextEventDecoder({ file: 'aisle.csv', ...options });
  const batch = concatBatches([decoder.push(new TextEncoder().encode(text)), decoder.end()]);
  return {
    events: Array.from(batch.t, (t, i) => [t, batch.x[i]!, batch.y[i]!, batch.p[i]!]),
    format: decoder.format,
    resolution: decoder.resolution,
    declaredSensor: decoder.declaredSensor,
    extent: decoder.extent,
    eventCount: decoder.eventCount,
    lineCount: decoder.lineCount,
    bytesRead: decoder.bytesRead,
  };
}

describe('TextEventDecoder formats', () => {
  it('reads CSV with a header, t in integer microseconds by default', () => {
    const out = decode('t,x,y,p\n1000017,312,40,1\n1000017,313,40,0\n1000250,2,479,1\n');
    expect(out.events).toEqual([
      [1000017, 312, 40, 1],
      [1000017, 313, 40, 0],
      [1000250, 2, 479, 1],
    ]);
    expect(out).toMatchObject({ format: 'csv', resolution: 'us', declaredSensor: null, eventCount: 3, lineCount: 4, bytesRead: 58 });
  });

  it('takes the CSV columns in any order, with spaces around fields and a quoted header', () => {
    const out = decode('"p", y ,x,T\n1, 40 ,312,5\n0,41, 313 ,6\n');
    expect(out.events).toEqual([
      [5, 312, 40, 1],
      [6, 313, 41, 0],
    ]);
  });

  it('reads headerless whitespace lines with t in seconds as exact nanoseconds', () => {
    const out = decode('0.000000001 33 39 1\n0.5\t34\t39\t0\n  12.345678901   35  40  1  \n');
    expect(out.events).toEqual([
      [0.001, 33, 39, 1],
      [500000, 34, 39, 0],
      [12345678.901, 35, 40, 1],
    ]);
    expect(out).toMatchObject({ format: 'whitespace', resolution: 'ns', lineCount: 3 });
    // The stored µs are ticks / 1000, so Math.round(t * 1000) gives the nanoseconds back.
    expect(out.events.map(([t]) => Math.round(t! * 1000))).toEqual([1, 500000000, 12345678901]);
  });

  it('reads the sensor size from a first comment line, in both formats', () => {
    expect(decode('# width=640 height=480\nt,x,y,p\n1,639,479,1\n').declaredSensor).toEqual({ width: 640, height: 480 });
    const ws = decode('#width = 346  height= 260\n1.0 345 259 0\n');
    expect(ws).toMatchObject({ declaredSensor: { width: 346, height: 260 }, format: 'whitespace', lineCount: 2 });
  });

  it('tracks the extent of the events (max + 1) for inferring a sensor size', () => {
    expect(decode('t,x,y,p\n1,0,0,1\n2,345,17,0\n3,12,259,1\n').extent).toEqual({ width: 346, height: 260 });
  });

  it('accepts CRLF line endings and skips blank lines, which still count as lines', () => {
    const out = decode('t,x,y,p\r\n\r\n1,2,3,1\r\n   \r\n\n2,3,4,0\r\n');
    expect(out.events).toEqual([
      [1, 2, 3, 1],
      [2, 3, 4, 0],
    ]);
    expect(out.lineCount).toBe(6);
  });

  it('stores polarity -1/1 as OFF = 0 / ON = 1, and 0/1 as it is', () => {
    expect(decode('1 2 3 -1\n2 2 3 1\n').events.map((e) => e[3])).toEqual([0, 1]);
    expect(decode('1 2 3 0\n2 2 3 1\n').events.map((e) => e[3])).toEqual([0, 1]);
  });

  it('reads a last line without a newline at end()', () => {
    const decoder = new TextEventDecoder({ file: 'aisle.csv' });
    expect(decoder.push(new TextEncoder().encode('t,x,y,p\n1,2,3,1\n2,3,4,0')).t.length).toBe(1);
    expect(Array.from(decoder.end().t)).toEqual([2]);
    expect(decoder.lineCount).toBe(3);
  });

  it('skips a UTF-8 byte order mark', () => {
    expect(decode('\ufefft,x,y,p\n1,2,3,1\n').events).toEqual([[1, 2, 3, 1]]);
  });

  it('allows equal and, with allowUnsorted, decreasing timestamps', () => {
    expect(decode('t,x,y,p\n5,1,1,1\n5,2,2,1\n').eventCount).toBe(2);
    expect(decode('t,x,y,p\n5,1,1,1\n3,2,2,1\n', { allowUnsorted: true }).events.map((e) => e[0])).toEqual([5, 3]);
  });
});

describe('TextEventDecoder time units and resolution', () => {
  // The resolution rule of the issue: us and ms give 'us'; ns, s and headerless seconds give 'ns'.
  it.each([
    ['t_us', '1500', 1500, 'us'],
    ['t', '1500', 1500, 'us'],
    ['t_ms', '1.5', 1500, 'us'],
    ['t_ms', '2', 2000, 'us'],
    ['t_ms', '0.001', 1, 'us'],
    ['t_ns', '1500', 1.5, 'ns'],
    ['t_s', '0.0000015', 1.5, 'ns'],
    ['t_s', '3', 3e6, 'ns'],
  ] as const)('header %s: %s is %f µs at resolution %s', (column, value, us, resolution) => {
    const out = decode(`${column},x,y,p\n${value},1,2,1\n`);
    expect(out.events[0]![0]).toBe(us);
    expect(out.resolution).toBe(resolution);
  });

  it.each([
    ['us', '1500', 1500, 'us'],
    ['ms', '1.5', 1500, 'us'],
    ['ns', '1500', 1.5, 'ns'],
    ['s', '1.5', 1.5e6, 'ns'],
  ] as const)('the time unit option %s applies to a plain t column', (timeUnit, value, us, resolution) => {
    const out = decode(`t,x,y,p\n${value},1,2,1\n`, { timeUnit });
    expect(out.events[0]![0]).toBe(us);
    expect(out.resolution).toBe(resolution);
  });

  it('the time unit option applies to headerless lines, whose default is seconds', () => {
    expect(decode('1500 1 2 1\n', { timeUnit: 'us' })).toMatchObject({ events: [[1500, 1, 2, 1]], resolution: 'us' });
    expect(decode('1500 1 2 1\n')).toMatchObject({ events: [[1.5e9, 1, 2, 1]], resolution: 'ns' });
  });

  it('accepts an option that agrees with the header unit', () => {
    expect(decode('t_ms,x,y,p\n1.5,1,2,1\n', { timeUnit: 'ms' }).events[0]![0]).toBe(1500);
  });

  it('parses timestamps exactly, not through parseFloat', () => {
    // 0.1 s + 0.2 s in floating point is 0.30000000000000004 s; as decimal text it is 300000000 ns.
    const out = decode('0.1 1 1 1\n0.3 1 1 1\n4503599.627370495 1 1 1\n');
    expect(out.events.map(([t]) => Math.round(t! * 1000))).toEqual([100000000, 300000000, 4503599627370495]);
    expect(decode('t,x,y,p\n9007199254740991,1,1,1\n').events[0]![0]).toBe(Number.MAX_SAFE_INTEGER);
  });

  it('round-trips nanoseconds through Math.round(t * 1000) up to 2^52 ns (about 52 days)', () => {
    // IEEE 754 double arithmetic (common practice, no source): spot checks across the range.
    const ticks = [1, 999, 123456789, 2 ** 40 + 7, 2 ** 51 + 3, 2 ** 52 - 1, 2 ** 52];
    const text = ticks.map((n) => `${Math.floor(n / 1e9)}.${String(n % 1e9).padStart(9, '0')} 0 0 1`).join('\n');
    expect(decode(text).events.map(([t]) => Math.round(t! * 1000))).toEqual(ticks);
  });

  it('reports the resolution of the option before the format is known', () => {
    expect(new TextEventDecoder({ file: 'a', timeUnit: 'ns' }).resolution).toBe('ns');
    expect(new TextEventDecoder({ file: 'a' }).format).toBeNull();
  });
});

describe('TextEventDecoder options', () => {
  it('rejects invalid options with a RangeError naming them', () => {
    expect(() => new TextEventDecoder({ file: 'a', timeUnit: 'h' as never })).toThrow(/timeUnit/);
    expect(() => new TextEventDecoder({ file: 'a', sensor: { width: 0, height: 10 } })).toThrow(RangeError);
    expect(() => new TextEventDecoder({ file: 'a', sensor: { width: 65537, height: 10 } })).toThrow(/sensor/);
  });

  it('checks coordinates against a sensor size given in the options', () => {
    expect(decode('t,x,y,p\n1,345,259,1\n', { sensor: { width: 346, height: 260 } }).eventCount).toBe(1);
    expect(() => decode('t,x,y,p\n1,346,0,1\n', { sensor: { width: 346, height: 260 } })).toThrow(/346x260/);
  });

  it('refuses pushes after end()', () => {
    const decoder = new TextEventDecoder({ file: 'a' });
    decoder.push(new TextEncoder().encode('1 2 3 1\n'));
    decoder.end();
    expect(() => decoder.push(new Uint8Array([49]))).toThrow(/end\(\)/);
  });
});
