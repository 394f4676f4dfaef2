import { describe, expect, it } from 'vitest';
import { parseFeedLine, type FeedHeader, type FeedItem } from '../../../../app/core/gaze/feed';

// The gaze feed is a protocol of our own: these checks hold the parser to the definition
// written in the README (common practice, no source).

function headerOf(line: string): FeedHeader {
  const item = parseFeedLine(line, null);
  if (item.kind !== 'hello') throw new Error(`not a hello: ${JSON.stringify(item)}`);
  return item.header;
}

const reasonOf = (item: FeedItem): string => (item.kind === 'garbage' ? item.reason : `not garbage: ${item.kind}`);

const both = headerOf('{"gazeloom_feed":1,"units":"screen_px","rate_hz":500,"eyes":"both","screen":[1920,1080],"pupil":"mm","source":"aisle bench rig"}');
const leftOnly = headerOf('{"gazeloom_feed":1,"units":"screen_px","rate_hz":250,"eyes":"left"}');

describe('hello lines', () => {
  it('map every field to GazeHello', () => {
    expect(both).toEqual({
      hello: { protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 500, eyes: 'both', screen: { widthPx: 1920, heightPx: 1080 }, pupilUnit: 'mm', source: 'aisle bench rig' },
      tsvSeq: false,
    });
  });

  it('leave optional fields null and ignore fields this version does not know', () => {
    const h = headerOf('{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"right","tsv_seq":true,"firmware":"2.1"}');
    expect(h).toEqual({ hello: { protocol: 'gazeloom-feed', version: 1, units: 'raw', rateHz: 60, eyes: 'right', screen: null, pupilUnit: null, source: null }, tsvSeq: true });
  });

  it.each([
    ['{"gazeloom_feed":2,"units":"raw","rate_hz":60,"eyes":"left"}', 'unsupported protocol version 2'],
    ['{"gazeloom_feed":"1","units":"raw","rate_hz":60,"eyes":"left"}', 'unsupported protocol version "1"'],
    ['{"gazeloom_feed":1,"units":"degrees","rate_hz":60,"eyes":"left"}', '"units" must be one of screen_px, screen_norm, raw'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":0,"eyes":"left"}', '"rate_hz" must be a number above 0'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":"500","eyes":"left"}', '"rate_hz" must be a number'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":-5,"eyes":"left"}', '"rate_hz" must be a number above 0'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":60}', '"eyes" must be one of left, right, both'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"left","screen":[1920]}', '"screen" must be [width_px, height_px]'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"left","screen":[1920.5,1080]}', '"screen" must be [width_px, height_px]'],
    ['{"gazeloom_feed":1,"units":"screen_norm","rate_hz":60,"eyes":"left"}', '"screen" [width_px, height_px] is required when "units" is "screen_norm"'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"left","pupil":"inches"}', '"pupil" must be one of mm, px, arbitrary'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"left","source":42}', '"source" must be a string'],
    ['{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"left","tsv_seq":"yes"}', '"tsv_seq" must be true or false'],
  ])('reports a bad hello as garbage naming the field: %s', (line, reason) => {
    expect(reasonOf(parseFeedLine(line, null))).toContain(reason);
  });
});

describe('NDJSON samples', () => {
  it('read seq, timestamp and both eyes with pupil', () => {
    expect(parseFeedLine('{"t":12.345678,"seq":17,"l":[960.5,540.25,1,3.1],"r":[970,541,1,3.2]}', both)).toEqual({
      kind: 'sample',
      sample: { seq: 17, trackerTimeS: 12.345678, left: { x: 960.5, y: 540.25, valid: true, pupil: 3.1 }, right: { x: 970, y: 541, valid: true, pupil: 3.2 } },
    });
  });

  it('keep invalid samples (blinks), with NaN where the coordinates were left out', () => {
    const item = parseFeedLine('{"t":1.5,"l":[null,null,0,null],"r":[12,13,false]}', both);
    expect(item).toEqual({
      kind: 'sample',
      sample: { seq: null, trackerTimeS: 1.5, left: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null }, right: { x: 12, y: 13, valid: false, pupil: null } },
    });
  });

  it('take validity as true/false as well as 1/0, and leave the undeclared eye null', () => {
    expect(parseFeedLine('{"t":2,"l":[1,2,true]}', leftOnly)).toEqual({ kind: 'sample', sample: { seq: null, trackerTimeS: 2, left: { x: 1, y: 2, valid: true, pupil: null }, right: null } });
  });

  it.each([
    ['{"t":1,"l":[1,2,1]}', 'missing "r" (right eye; the hello declared eyes both)'],
    ['{"t":"1","l":[1,2,1],"r":[1,2,1]}', '"t" must be a finite number of seconds'],
    ['{"t":1,"seq":-1,"l":[1,2,1],"r":[1,2,1]}', '"seq" must be an integer of at least 0'],
    ['{"t":1,"seq":1.5,"l":[1,2,1],"r":[1,2,1]}', '"seq" must be an integer of at least 0'],
    ['{"t":1,"l":[1,2,2],"r":[1,2,1]}', '"l" validity must be 0 or 1'],
    ['{"t":1,"l":[null,2,1],"r":[1,2,1]}', 'eye "l" is marked valid but its x, y are not finite numbers'],
    ['{"t":1,"l":["1",2,1],"r":[1,2,1]}', '"l" x and y must be numbers'],
    ['{"t":1,"l":[1,2],"r":[1,2,1]}', '"l" must be [x, y, valid, pupil]'],
    ['{"t":1,"l":[1,2,1,3,4],"r":[1,2,1]}', '"l" must be [x, y, valid, pupil]'],
    ['{"t":1,"l":{"x":1},"r":[1,2,1]}', '"l" must be [x, y, valid, pupil]'],
    ['{"t":1,"l":[1,2,1,"big"],"r":[1,2,1]}', '"l" pupil must be a number or null'],
    ['{"t":1,"l":[1,2,1],"r":[1,2,1],"seq":NaN}', 'not valid JSON'],
    ['{"t":NaN,"l":[1,2,1],"r":[1,2,1]}', 'not valid JSON'],
    ['{"t":1,"l":[1,2,1]', 'not valid JSON'],
    ['{"seq":3,"l":[1,2,1],"r":[1,2,1]}', 'neither a hello (no "gazeloom_feed") nor a sample (no "t")'],
  ])('report a bad sample as garbage: %s', (line, reason) => {
    expect(reasonOf(parseFeedLine(line, both))).toContain(reason);
  });

  it('refuse an eye the hello did not declare and pupil without a declared unit', () => {
    expect(reasonOf(parseFeedLine('{"t":1,"l":[1,2,1],"r":[1,2,1]}', leftOnly))).toContain('"r" sent but the hello declared eyes left');
    expect(reasonOf(parseFeedLine('{"t":1,"l":[1,2,1,3]}', leftOnly))).toContain('"l" must be [x, y, valid] (the hello declared no pupil unit)');
  });

  it('count a sample before any hello as garbage, JSON or TSV', () => {
    expect(reasonOf(parseFeedLine('{"t":1,"l":[1,2,1]}', null))).toBe('sample before any hello');
    expect(reasonOf(parseFeedLine('1\t1\t2\t1', null))).toBe('sample before any hello');
  });
});

describe('TSV samples', () => {
  const tsvBoth = headerOf('{"gazeloom_feed":1,"units":"screen_px","rate_hz":500,"eyes":"both","pupil":"px","tsv_seq":true}');

  it('read [seq] t, then x, y, validity and pupil per declared eye, left first', () => {
    expect(parseFeedLine('17\t12.5\t100\t200\t1\t31.5\t110\t210\t0\tnan', tsvBoth)).toEqual({
      kind: 'sample',
      sample: { seq: 17, trackerTimeS: 12.5, left: { x: 100, y: 200, valid: true, pupil: 31.5 }, right: { x: 110, y: 210, valid: false, pupil: null } },
    });
    expect(parseFeedLine('3.25\t-4\t1e3\t1', leftOnly)).toEqual({ kind: 'sample', sample: { seq: null, trackerTimeS: 3.25, left: { x: -4, y: 1000, valid: true, pupil: null }, right: null } });
  });

  it('keep an invalid eye with "nan" or empty coordinates', () => {
    const item = parseFeedLine('4\tnan\t\t0', leftOnly);
    expect(item).toEqual({ kind: 'sample', sample: { seq: null, trackerTimeS: 4, left: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null }, right: null } });
  });

  it.each([
    ['1\t2\t3', leftOnly, 'expected 4 tab-separated fields for this hello, got 3'],
    ['1 2 3 1', leftOnly, 'expected 4 tab-separated fields for this hello, got 1'],
    ['1\t2\t3\t1\t5', leftOnly, 'expected 4 tab-separated fields for this hello, got 5'],
    ['\t2\t3\t1', leftOnly, 'TSV field 1 (t) must be a number of seconds, got ""'],
    ['nan\t2\t3\t1', leftOnly, 'TSV field 1 (t) must be a number of seconds'],
    ['Infinity\t2\t3\t1', leftOnly, 'TSV field 1 (t) must be a number of seconds'],
    ['1e999\t2\t3\t1', leftOnly, 'TSV field 1 (t) must be a number of seconds'],
    ['1\t0x10\t3\t1', leftOnly, 'TSV field 2 (l x) must be a number, "nan" or empty, got "0x10"'],
    ['1\t2\t3\t2', leftOnly, 'TSV field 4 (l validity) must be 0 or 1, got "2"'],
    ['1\tnan\t3\t1', leftOnly, 'eye "l" is marked valid but its x, y are not finite numbers'],
    ['1.5\t1\t1\t1\t1\t1\t1\t1\t1\t1', tsvBoth, 'TSV field 1 (seq) must be an integer of at least 0, got "1.5"'],
    ['7\t1\t1\t1\t1\tbig\t1\t1\t1\t1', tsvBoth, 'TSV field 6 (l pupil) must be a number, "nan" or empty'],
  ])('report a bad TSV line as garbage: %j', (line, header, reason) => {
    expect(reasonOf(parseFeedLine(line, header))).toContain(reason);
  });
});

describe('screen_norm', () => {
  const norm = headerOf('{"gazeloom_feed":1,"units":"screen_norm","rate_hz":120,"eyes":"both","screen":[1920,1080]}');

  it('is converted to screen pixels on arrival with the hello screen size (origin top-left, y down)', () => {
    const item = parseFeedLine('{"t":1,"l":[0.5,0.25,1],"r":[1,1,1]}', norm);
    expect(item).toMatchObject({ sample: { left: { x: 960, y: 270 }, right: { x: 1920, y: 1080 } } });
    expect(parseFeedLine('1\t0\t0\t1\t0.75\t0.5\t1', norm)).toMatchObject({ sample: { left: { x: 0, y: 0 }, right: { x: 1440, y: 540 } } });
  });

  it('leaves screen_px and raw coordinates as sent, even with a screen size', () => {
    expect(parseFeedLine('{"t":1,"l":[0.5,0.25,1],"r":[1,1,1]}', both)).toMatchObject({ sample: { left: { x: 0.5, y: 0.25 } } });
  });
});

describe('lines that are no sample at all', () => {
  it.each([
    ['', 'empty line'],
    ['[1,2,3]', 'expected 9 tab-separated fields for this hello, got 1'],
    ['{}', 'neither a hello'],
    ['{"gazeloom_feed":1', 'not valid JSON'],
  ])('%j is garbage', (line, reason) => {
    const item = parseFeedLine(line, both);
    expect(item.kind).toBe('garbage');
    expect(reasonOf(item)).toContain(reason);
  });

  it('shortens a long bad line in its reason', () => {
    const reason = reasonOf(parseFeedLine(`{${'x'.repeat(500)}`, both));
    expect(reason.length).toBeLessThan(100);
  });
});
