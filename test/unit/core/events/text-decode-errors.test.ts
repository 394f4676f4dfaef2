import { describe, expect, it } from 'vitest';
import { EventFormatError } from '../../../../app/core/events/event-format-error';
import { TextEventDecoder, type TextDecoderOptions } from '../../../../app/core/events/text/text-event-decoder';

// Every validation error of the issue, with its message and 1-based physical line (the
// comment and header lines count). The wording is ours (common practice, no source).

function errorOf(text: string, options: Partial<TextDecoderOptions> = {}): EventFormatError {
  const decoder = new TextEventDecoder({ file: 'aisle.csv', ...options });
  try {
    decoder.push(new TextEncoder().encode(text));
    decoder.end();
  } catch (error) {
    if (error instanceof EventFormatError) return error;
    throw error;
  }
  throw new Error('decoded without an error');
}

const HEADER = 't,x,y,p\n';

describe('text decode errors', () => {
  it.each([
    ['too few CSV fields', `${HEADER}1,2,3,1\n2,3,4\n`, 'line 3', 'expected 4 fields (t,x,y,p), found 3'],
    ['too many CSV fields', `${HEADER}1,2,3,1,9\n`, 'line 2', 'expected 4 fields (t,x,y,p), found 5'],
    ['too few fields, columns out of order', 'x,y,t,p\n1,2\n', 'line 2', 'expected 4 fields (x,y,t,p), found 2'],
    ['too few whitespace fields', '0.5 1 2\n', 'line 1', 'expected 4 fields (t x y p), found 3'],
    ['too many whitespace fields', '0.5 1 2 1 7\n', 'line 1', 'expected 4 fields (t x y p), found 5'],
    ['a non-numeric x', `${HEADER}1,abc,3,1\n`, 'line 2', "column x: expected a whole number, got 'abc'"],
    ['an empty y', `${HEADER}1,2,,1\n`, 'line 2', 'column y: expected a whole number, got nothing'],
    ['text after a number', `${HEADER}1,2,3px,1\n`, 'line 2', "column y: expected a whole number, got '3px'"],
    ['a decimal coordinate', `${HEADER}1,2.5,3,1\n`, 'line 2', "column x: expected a whole number, got '2.5'"],
    ['a non-numeric t', `${HEADER}soon,2,3,1\n`, 'line 2', "column t: expected a number, got 'soon'"],
    ['two numbers in one CSV field', `${HEADER}1 2,2,3,1\n`, 'line 2', "column t: expected a number, got '1 2'"],
    ['a non-numeric p', '0.5 1 2 on\n', 'line 1', "column p: expected a polarity (0 or 1, or -1 and 1), got 'on'"],
    ['a t with an exponent', '1e-3 1 2 1\n', 'line 1', "column t: expected a number, got '1e-3'"],
    ['a negative x', `${HEADER}1,-2,3,1\n`, 'line 2', "column x: coordinates cannot be negative, got '-2'"],
    ['a negative y', '0.5 1 -3 1\n', 'line 1', "column y: coordinates cannot be negative, got '-3'"],
    ['a coordinate above 65535', `${HEADER}1,65536,3,1\n`, 'line 2', 'column x: 65536 is above 65535, the largest coordinate'],
    ['an unknown polarity', `${HEADER}1,2,3,2\n`, 'line 2', "column p: polarity must be 0 or 1 (or -1 and 1), got '2'"],
    ['polarity -0', `${HEADER}1,2,3,-0\n`, 'line 2', "column p: polarity must be 0 or 1 (or -1 and 1), got '-0'"],
    ['polarity 1.0', `${HEADER}1,2,3,1.0\n`, 'line 2', "column p: polarity must be 0 or 1 (or -1 and 1), got '1.0'"],
    ['a negative t', `${HEADER}-5,2,3,1\n`, 'line 2', "column t: timestamps cannot be negative, got '-5'"],
    ['decimals in whole µs', `${HEADER}1.5,2,3,1\n`, 'line 2', "column t: '1.5' has decimals, but t is in whole microseconds; give t in ns (t_ns) for finer times"],
    ['decimals in whole ns', 't_ns,x,y,p\n1.5,2,3,1\n', 'line 2', "column t: '1.5' has decimals, but t is in whole nanoseconds"],
    ['too many ms decimals', 't_ms,x,y,p\n1.2345,2,3,1\n', 'line 2', "column t: '1.2345' has more than 3 decimals, finer than a microsecond; give t in us or ns (t_us, t_ns)"],
    ['too many s decimals', '1.0000000001 2 3 1\n', 'line 1', "column t: '1.0000000001' has more than 9 decimals, finer than a nanosecond"],
    ['a µs time beyond 2^53', `${HEADER}9007199254740992,2,3,1\n`, 'line 2', "column t: '9007199254740992' is too large to hold exactly (at most 9007199254740991 us)"],
    ['a seconds time beyond 2^52 ns', '4503599.627370497 2 3 1\n', 'line 1', "column t: '4503599.627370497' is too large to hold exactly (at most 4503599.627370496 s)"],
  ])('%s', (_, text, location, problem) => {
    const error = errorOf(text);
    expect(error.location).toBe(location);
    expect(error.problem).toBe(problem);
    expect(error.message).toBe(`aisle.csv ${location}: ${problem}`);
  });

  it('names the line of a decrease, the earlier line and value, and suggests --sort', () => {
    const error = errorOf(`# width=640 height=480\n${HEADER}1500,1,1,1\n1600,1,1,1\n\n1600,2,2,0\n1500,3,3,1\n`);
    expect(error.message).toBe('aisle.csv line 7: timestamp 1500 is earlier than 1600 on line 6 (use --sort to reorder)');
  });

  it('writes the times of a decrease in the file’s own unit', () => {
    expect(errorOf('1.25 1 1 1\n1.2 1 1 1\n').problem).toBe('timestamp 1.2 is earlier than 1.25 on line 1 (use --sort to reorder)');
    expect(errorOf('t_ms,x,y,p\n2.5,1,1,1\n0.001,1,1,1\n').problem).toBe('timestamp 0.001 is earlier than 2.5 on line 2 (use --sort to reorder)');
  });

  it('names the line where 0 and -1 are mixed as OFF', () => {
    expect(errorOf(`${HEADER}1,1,1,1\n2,1,1,0\n3,1,1,1\n4,1,1,-1\n`).message).toBe(
      'aisle.csv line 5: OFF is written as -1 here but as 0 on line 3; use 0/1 or -1/1 for polarity, not both',
    );
    expect(errorOf('1 1 1 -1\n2 1 1 0\n').message).toBe('aisle.csv line 2: OFF is written as 0 here but as -1 on line 1; use 0/1 or -1/1 for polarity, not both');
  });

  it('checks coordinates against the sensor from the comment line, naming the size', () => {
    const text = `# width=346 height=260\n${HEADER}1,345,259,1\n2,3,260,1\n`;
    expect(errorOf(text).message).toBe('aisle.csv line 4: column y: 260 is outside the 346x260 sensor (y must be below 260)');
    expect(errorOf('# width=346 height=260\n1.0 346 0 1\n').message).toBe('aisle.csv line 2: column x: 346 is outside the 346x260 sensor (x must be below 346)');
  });

  it.each([
    ['lacks a column', 't,x,y\n', 'line 1', 'the header lacks column p; expected the columns t, x, y, p in any order (t may be t_us, t_ns, t_ms or t_s)'],
    ['lacks columns', 't,x\n', 'line 1', 'the header lacks columns y, p; expected the columns t, x, y, p in any order (t may be t_us, t_ns, t_ms or t_s)'],
    ['repeats a column', '# width=2 height=2\nt,x,x,p\n', 'line 2', 'the header names column x more than once'],
    ['repeats t with another unit', 't_us,x,y,p,t_ns\n', 'line 1', 'the header names column t more than once'],
    ['names an unknown column', 't,x,y,p,brightness\n', 'line 1', "unknown column 'brightness' in the header; expected the columns t, x, y, p in any order (t may be t_us, t_ns, t_ms or t_s)"],
    ['is missing from a CSV file', '1,2,3,1\n', 'line 1', "a CSV file needs a header row naming its columns, e.g. 't,x,y,p'; expected the columns t, x, y, p in any order (t may be t_us, t_ns, t_ms or t_s)"],
    ['is a whitespace header', 't x y p\n0.5 1 2 1\n', 'line 1', "expected a CSV header naming the columns t, x, y, p, or headerless lines 't x y p' with t in seconds; got 't x y p'"],
  ])('a header that %s', (_, text, location, problem) => {
    const error = errorOf(text);
    expect([error.location, error.problem]).toEqual([location, problem]);
  });

  it('names both units when the header and the option disagree', () => {
    expect(errorOf('t_ms,x,y,p\n1,2,3,1\n', { timeUnit: 'us' }).message).toBe('aisle.csv line 1: the header gives t in ms (t_ms) but the time unit option says us');
    expect(errorOf('\n\nt_s,x,y,p\n1,2,3,1\n', { timeUnit: 'ns' }).location).toBe('line 3');
  });

  it('names both sizes when the comment line and the option disagree', () => {
    expect(errorOf('# width=640 height=480\nt,x,y,p\n1,2,3,1\n', { sensor: { width: 346, height: 260 } }).message).toBe(
      'aisle.csv line 1: the file declares a 640x480 sensor but the sensor size given is 346x260',
    );
  });

  it.each([
    ['a malformed size comment', '# recorded in the aisle\nt,x,y,p\n', 'line 1', "expected '# width=W height=H' declaring the sensor size, got '# recorded in the aisle'"],
    ['a zero size', '# width=0 height=480\n', 'line 1', 'sensor size 0x480 is out of range (width and height from 1 to 65536)'],
    ['a comment after the first line', '\n# width=640 height=480\nt,x,y,p\n', 'line 2', "only the first line may be a comment, and only '# width=W height=H'"],
    ['a comment among the events', 't,x,y,p\n1,2,3,1\n# parcel\n', 'line 3', "column t: expected a number, got '# parcel'"],
  ])('%s', (_, text, location, problem) => {
    const error = errorOf(text);
    expect([error.location, error.problem]).toEqual([location, problem]);
  });

  it.each([
    ['an empty file', ''],
    ['only blank lines', '\n\r\n  \n'],
    ['only the size comment', '# width=640 height=480\n'],
    ['only a header', `# width=640 height=480\n${HEADER}\n\n`],
  ])('says "no events" for %s', (_, text) => {
    const error = errorOf(text);
    expect([error.location, error.problem, error.message]).toEqual(['', 'no events', 'aisle.csv: no events']);
  });

  it('keeps failing after an error', () => {
    const decoder = new TextEventDecoder({ file: 'aisle.csv' });
    expect(() => decoder.push(new TextEncoder().encode(`${HEADER}1,x,2,1\n`))).toThrow(/line 2/);
    expect(() => decoder.push(new TextEncoder().encode('2,2,2,1\n'))).toThrow(/line 2/);
    expect(() => decoder.end()).toThrow(/line 2/);
  });
});
