import { describe, expect, it } from 'vitest';
import { FeedLineDecoder, type FeedItem } from '../../../../app/core/gaze/feed';

// Line framing of the gaze feed (protocol of our own; common practice, no source).
const hello = '{"gazeloom_feed":1,"units":"screen_px","rate_hz":500,"eyes":"left","source":"Gabelstapler-Prüfstand ✓"}';
const stream = `${hello}\n{"t":1,"seq":1,"l":[1,2,1]}\r\n\n2\t3\t4\t1\n   \n{"t":3,"seq":3,"l":[null,null,0]}\n`;
const kinds = (items: FeedItem[]) => items.map((i) => (i.kind === 'sample' ? `sample@${i.sample.trackerTimeS}` : i.kind));

describe('FeedLineDecoder', () => {
  it('decodes a stream into hello and samples, skipping blank lines and accepting CRLF', () => {
    const d = new FeedLineDecoder();
    expect(kinds([...d.push(stream), ...d.flush()])).toEqual(['hello', 'sample@1', 'sample@2', 'sample@3']);
  });

  it('gives the same lines however the bytes are split, even inside a UTF-8 character', () => {
    const bytes = new TextEncoder().encode(stream);
    const whole = new FeedLineDecoder();
    const expected = [...whole.push(bytes), ...whole.flush()];
    expect(expected[0]).toMatchObject({ kind: 'hello', hello: { source: 'Gabelstapler-Prüfstand ✓' } });
    for (let cut = 1; cut < bytes.length; cut++) {
      const d = new FeedLineDecoder();
      const got = [...d.push(bytes.subarray(0, cut)), ...d.push(bytes.subarray(cut)), ...d.flush()];
      expect(got).toEqual(expected);
    }
    const oneByOne = new FeedLineDecoder();
    const got: FeedItem[] = [];
    for (const b of bytes) got.push(...oneByOne.push(Uint8Array.of(b)));
    expect([...got, ...oneByOne.flush()]).toEqual(expected);
  });

  it('keeps a partial line until its newline arrives, and flush ends it (a datagram without a final newline)', () => {
    const d = new FeedLineDecoder();
    expect(kinds(d.push(`${hello}\n{"t":1,"l":[1,`))).toEqual(['hello']);
    expect(kinds(d.push('2,1]}'))).toEqual([]);
    expect(kinds(d.flush())).toEqual(['sample@1']);
    expect(kinds(d.flush())).toEqual([]);
  });

  it('reads several lines from one datagram', () => {
    const d = new FeedLineDecoder();
    d.push(hello);
    d.flush();
    expect(kinds([...d.push('5\t1\t1\t1\n6\t1\t1\t1\n7\t1\t1\t1'), ...d.flush()])).toEqual(['sample@5', 'sample@6', 'sample@7']);
  });

  it('accepts a new hello mid-stream and reads later lines with its layout', () => {
    const d = new FeedLineDecoder();
    d.push(`${hello}\n`);
    expect(d.current?.tsvSeq).toBe(false);
    const items = d.push('{"gazeloom_feed":1,"units":"raw","rate_hz":60,"eyes":"both","tsv_seq":true}\n9\t1.5\t1\t1\t1\t2\t2\t0\n1.5\t1\t1\t1\n');
    expect(kinds(items)).toEqual(['hello', 'sample@1.5', 'garbage']);
    expect(items[1]).toMatchObject({ sample: { seq: 9, right: { x: 2, valid: false } } });
    expect(d.current?.hello).toMatchObject({ units: 'raw', rateHz: 60, eyes: 'both' });
  });

  it('reports an overlong line once and skips to its newline, then carries on', () => {
    const d = new FeedLineDecoder({ maxLineChars: 200 });
    d.push(`${hello}\n`);
    const items = [...d.push('x'.repeat(80)), ...d.push('x'.repeat(80)), ...d.push('x'.repeat(80)), ...d.push('\n7\t1\t1\t1\n')];
    expect(items).toEqual([{ kind: 'garbage', reason: 'line longer than 200 characters without a newline; skipped' }, expect.objectContaining({ kind: 'sample' })]);
    expect(kinds([...d.push(`${'y'.repeat(250)}\n`)])).toEqual(['garbage']);
  });

  it('refuses a bad maxLineChars', () => {
    expect(() => new FeedLineDecoder({ maxLineChars: 0 })).toThrow(RangeError);
  });
});
