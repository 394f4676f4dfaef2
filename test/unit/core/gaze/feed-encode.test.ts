import { describe, expect, it } from 'vitest';
import { encodeHello, encodeSampleNdjson, encodeSampleTsv, parseFeedLine, type FeedHeader } from '../../../../app/core/gaze/feed';
import type { EyeSample, GazeHello, GazeSample } from '../../../../app/core/gaze/gaze-sample';
import { Xoshiro128 } from '../../../../app/core/random/xoshiro128';

// Encoders and parser are two halves of our own protocol: what one writes the other reads
// back exactly (common practice, no source).
const hello: GazeHello = { protocol: 'gazeloom-feed', version: 1, units: 'screen_px', rateHz: 1000, eyes: 'both', screen: { widthPx: 2560, heightPx: 1440 }, pupilUnit: 'arbitrary', source: 'conveyor line tracker' };

function randomEye(g: Xoshiro128, pupil: boolean): EyeSample {
  const valid = g.next() > 0.2;
  const blinkWithoutCoordinates = !valid && g.next() > 0.5;
  return {
    x: blinkWithoutCoordinates ? Number.NaN : (g.next() - 0.1) * 2560,
    y: blinkWithoutCoordinates ? Number.NaN : (g.next() - 0.1) * 1440,
    valid,
    pupil: pupil && g.next() > 0.1 ? g.next() * 8 : null,
  };
}

function randomSample(g: Xoshiro128, i: number, withSeq: boolean, pupil: boolean): GazeSample {
  return { seq: withSeq ? i : null, trackerTimeS: 1e5 + i / 1000 + g.next() * 1e-7, left: randomEye(g, pupil), right: randomEye(g, pupil) };
}

describe('encodeHello', () => {
  it('writes a hello the parser reads back to the same GazeHello and TSV layout', () => {
    for (const h of [hello, { ...hello, screen: null, pupilUnit: null, source: null, units: 'raw' as const, eyes: 'left' as const }]) {
      for (const tsvSeq of [false, true]) {
        const line = encodeHello(h, { tsvSeq });
        expect(parseFeedLine(line, null)).toEqual({ kind: 'hello', hello: h, header: { hello: h, tsvSeq } });
      }
    }
  });

  it('is one compact JSON line in the documented field names', () => {
    expect(encodeHello(hello, { tsvSeq: true })).toBe(
      '{"gazeloom_feed":1,"units":"screen_px","rate_hz":1000,"eyes":"both","screen":[2560,1440],"pupil":"arbitrary","source":"conveyor line tracker","tsv_seq":true}',
    );
  });
});

describe('sample round trips', () => {
  it('NDJSON: every number, blink and missing pupil comes back exactly', () => {
    const g = new Xoshiro128(7);
    const header: FeedHeader = { hello, tsvSeq: false };
    for (let i = 0; i < 2000; i++) {
      const sample = randomSample(g, i, i % 3 !== 0, true);
      expect(parseFeedLine(encodeSampleNdjson(sample), header)).toEqual({ kind: 'sample', sample });
    }
  });

  it('TSV, with and without seq and pupil columns', () => {
    const g = new Xoshiro128(8);
    for (const tsvSeq of [false, true]) {
      for (const pupilUnit of [null, 'mm'] as const) {
        const header: FeedHeader = { hello: { ...hello, pupilUnit }, tsvSeq };
        for (let i = 0; i < 500; i++) {
          const sample = randomSample(g, i, tsvSeq, pupilUnit !== null);
          const line = encodeSampleTsv(sample, header);
          expect(line.split('\t')).toHaveLength((tsvSeq ? 1 : 0) + 1 + 2 * (pupilUnit ? 4 : 3));
          expect(parseFeedLine(line, header)).toEqual({ kind: 'sample', sample });
        }
      }
    }
  });

  it('writes the documented compact forms', () => {
    const sample: GazeSample = { seq: 17, trackerTimeS: 12.345678, left: { x: 960.5, y: 540, valid: true, pupil: 3.1 }, right: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null } };
    expect(encodeSampleNdjson(sample)).toBe('{"t":12.345678,"seq":17,"l":[960.5,540,1,3.1],"r":[null,null,0]}');
    expect(encodeSampleTsv(sample, { hello, tsvSeq: true })).toBe('17\t12.345678\t960.5\t540\t1\t3.1\tnan\tnan\t0\tnan');
  });

  it('refuses to write a TSV sample that does not fit the header', () => {
    const sample: GazeSample = { seq: null, trackerTimeS: 1, left: { x: 1, y: 2, valid: true, pupil: null }, right: null };
    expect(() => encodeSampleTsv(sample, { hello, tsvSeq: true })).toThrow(/sample\.seq is required/);
    expect(() => encodeSampleTsv(sample, { hello, tsvSeq: false })).toThrow(/sample\.right is required/);
  });
});
