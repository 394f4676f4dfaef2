import { describe, expect, it } from 'vitest';
import { placeSensor } from '../../../../app/core/geometry/placement';
import { decimal, gazeCells, stimulusCells } from '../../../../app/core/recording/export-row';
import type { GazeRecord } from '../../../../app/core/recording/records';

const eye = (x: number, y: number, valid = true, pupil: number | null = null) => ({ x, y, valid, pupil });
const sample = (left: GazeRecord['left'], right: GazeRecord['right']): GazeRecord => ({ seq: 1, trackerTimeS: 1234.000123456789, arrivalNs: 0, hostNs: 0, left, right });

describe('export cells', () => {
  it('rounds without trailing zeros and never prints -0', () => {
    expect(decimal(1.5, 6)).toBe('1.5');
    expect(decimal(3, 4)).toBe('3');
    expect(decimal(-0.00001, 4)).toBe('0');
    expect(decimal(12.34567, 3)).toBe('12.346');
    expect(decimal(100, 0)).toBe('100');
  });

  it('writes the mean of the valid eyes, their mean pupil, and the tracker time exactly', () => {
    expect(gazeCells(sample(eye(100, 200, true, 3), eye(110, 220, true, 4)), 12.3456789)).toEqual(['12.345679', '105', '210', '3.5', '1234.000123456789']);
    expect(gazeCells(sample(eye(100, 200, false, 3), eye(110, 220, true, null)), 1)).toEqual(['1', '110', '220', 'n/a', '1234.000123456789']);
    expect(gazeCells(sample(eye(Number.NaN, Number.NaN, false), null), 1)).toEqual(['1', 'n/a', 'n/a', 'n/a', '1234.000123456789']);
  });

  it('maps gaze to sensor pixels through the placement, n/a off the sensor image or outside clips', () => {
    // A 640x480 sensor fitted on 1920x1080: scale 2.25, left (1920 - 1440) / 2 = 240, top 0.
    // Sensor pixel (x, y) covers screen [240 + 2.25 x, 240 + 2.25 (x + 1)), so screen
    // (240 + 2.25 * 10.5, 2.25 * 20.5) is the centre of sensor pixel (10, 20) (worked by hand).
    const placement = placeSensor({ width: 640, height: 480 }, { widthPx: 1920, heightPx: 1080 }, 'fit');
    const shown = { clip: 'forklift\tcrossing', stimulusUs: 2_500_000.25, placement };
    expect(stimulusCells(sample(eye(240 + 2.25 * 10.5, 2.25 * 20.5), null), shown)).toEqual(['forklift crossing', '2500000.25', '10', '20']);
    expect(stimulusCells(sample(eye(100, 500), null), shown)).toEqual(['forklift crossing', '2500000.25', 'n/a', 'n/a']); // in the letterbox
    expect(stimulusCells(sample(eye(1, 1, false), null), shown)).toEqual(['forklift crossing', '2500000.25', 'n/a', 'n/a']);
    expect(stimulusCells(sample(eye(500, 500), null), { ...shown, placement: null })).toEqual(['forklift crossing', '2500000.25', 'n/a', 'n/a']);
    expect(stimulusCells(sample(eye(500, 500), null), null)).toEqual(['n/a', 'n/a', 'n/a', 'n/a']);
  });
});
