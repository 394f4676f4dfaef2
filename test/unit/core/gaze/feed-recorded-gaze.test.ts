import { describe, expect, it } from 'vitest';
import { medianIntervalS, parseRecordedGazeTsv, RecordedGazeFormatError, replayHello, replaySample } from '../../../../app/core/gaze/feed';

// The gaze TSV of `gazeloom recording export` (issue 4: header row; timestamp, x_coordinate,
// y_coordinate in screen px, pupil_size, tracker_timestamp; "n/a" for invalid), read back
// for replay. Common practice, no source.
const header = 'timestamp\tx_coordinate\ty_coordinate\tpupil_size\ttracker_timestamp';
const tsv = [header, '10.000\t960\t540\t3.1\t5000.000', '10.002\tn/a\tn/a\tn/a\t5000.002', '10.004\t961.5\t541\t3.2\t5000.004', ''].join('\n');

describe('parseRecordedGazeTsv', () => {
  it('reads rows, with null for n/a', () => {
    expect(parseRecordedGazeTsv(tsv, 'gaze.tsv')).toEqual([
      { trackerTimeS: 5000, x: 960, y: 540, pupil: 3.1 },
      { trackerTimeS: 5000.002, x: null, y: null, pupil: null },
      { trackerTimeS: 5000.004, x: 961.5, y: 541, pupil: 3.2 },
    ]);
  });

  it('finds the columns by name and ignores the others (the --stimulus columns, CRLF endings)', () => {
    const text = 'clip\ttracker_timestamp\tsensor_x\ttimestamp\tpupil_size\ty_coordinate\tx_coordinate\r\nforklift-01\t7.5\t320\t1.5\tn/a\t20\t10\r\n';
    expect(parseRecordedGazeTsv(text, 'g.tsv')).toEqual([{ trackerTimeS: 7.5, x: 10, y: 20, pupil: null }]);
  });

  it.each([
    ['t\tx\ty\n1\t2\t3\n', 'g.tsv line 1: the header row lacks timestamp, x_coordinate, y_coordinate, pupil_size, tracker_timestamp'],
    [`${header}\n1\t2\t3\n`, 'g.tsv line 2: expected 5 tab-separated fields as in the header, got 3'],
    [`${header}\n1\t2\t3\t4\tn/a\n`, 'g.tsv line 2: tracker_timestamp must be a number, got "n/a"'],
    [`${header}\n1\t2\t3\t4\t5\n1\tabc\t3\t4\t5\n`, 'g.tsv line 3: x_coordinate must be a number or n/a, got "abc"'],
    [`${header}\n1\t2\tn/a\t4\t5\n`, 'g.tsv line 2: x_coordinate and y_coordinate must both be numbers or both n/a'],
    [`${header}\n`, 'g.tsv: no samples after the header row'],
  ])('names the file and line of a problem: %j', (text, message) => {
    expect(() => parseRecordedGazeTsv(text, 'g.tsv')).toThrow(RecordedGazeFormatError);
    expect(() => parseRecordedGazeTsv(text, 'g.tsv')).toThrow(message);
  });
});

describe('the replay hello and samples', () => {
  const rows = parseRecordedGazeTsv(tsv, 'gaze.tsv');

  it('takes the rate from the median interval, robust to a gap and a repeated timestamp', () => {
    const t = [0, 0.002, 0.004, 0.004, 0.006, 0.5, 0.502];
    expect(medianIntervalS(t.map((trackerTimeS) => ({ trackerTimeS, x: 1, y: 1, pupil: null })))).toBeCloseTo(0.002, 12);
    expect(replayHello(rows, 'replay of gaze.tsv')).toMatchObject({ units: 'screen_px', eyes: 'left', screen: null, pupilUnit: 'arbitrary', source: 'replay of gaze.tsv' });
    expect(replayHello(rows, 'r').rateHz).toBeCloseTo(500, 6);
  });

  it('declares no pupil when no row has one, and refuses a file without two increasing timestamps', () => {
    expect(replayHello(rows.map((r) => ({ ...r, pupil: null })), 'r').pupilUnit).toBeNull();
    expect(() => replayHello([rows[0]!], 'r')).toThrow(RangeError);
  });

  it('sends each row as a numbered left-eye sample, invalid where the row has n/a', () => {
    const hello = replayHello(rows, 'r');
    expect(replaySample(rows[0]!, 0, hello)).toEqual({ seq: 0, trackerTimeS: 5000, left: { x: 960, y: 540, valid: true, pupil: 3.1 }, right: null });
    expect(replaySample(rows[1]!, 1, hello)).toEqual({ seq: 1, trackerTimeS: 5000.002, left: { x: Number.NaN, y: Number.NaN, valid: false, pupil: null }, right: null });
  });
});
