import type { DisplayGeometry } from '../geometry/display-geometry';
import type { TargetResult } from '../study/records';
import { expectedSampleCount } from './data-loss';
import { pointQuality } from './point-quality';
import { samplesInWindow, type TimedSample } from './sample-window';
import { QualityFileError, type GazeRow, type TargetRow } from './validation-tsv';

export interface FileValidation {
  readonly points: TargetResult[];
  /** The sampling rate the expected counts use: 1 / the median interval between timestamps. */
  readonly rateHz: number;
  /** Over the points with valid gaze; null when none has any. */
  readonly meanAccuracyDeg: number | null;
  readonly maxAccuracyDeg: number | null;
}

/** Seconds to whole microseconds in ns, so window ends given in ms compare exactly. */
const toNs = (s: number): number => Math.round(s * 1e6) * 1e3;

function medianIntervalS(rows: readonly GazeRow[]): number | null {
  const steps = rows.slice(1).map((r, i) => r.timeS - rows[i]!.timeS).filter((d) => d > 0).sort((a, b) => a - b);
  if (steps.length === 0) return null;
  const m = steps.length >> 1;
  return steps.length % 2 === 1 ? steps[m]! : (steps[m - 1]! + steps[m]!) / 2;
}

/**
 * One validation from a gaze file and a targets file: per target, the samples from fromMs
 * to toMs after its onset (both ends included) measured by pointQuality (angles seen from
 * the eye, Holmqvist, Nyström and Mulvey 2012, ETRA). Each window expects its duration
 * times the file's rate, so rows missing from the file count as lost. A target must stay
 * up until its window ends, as on the stage.
 */
export function validationFromRows(gaze: readonly GazeRow[], targets: readonly TargetRow[], g: DisplayGeometry, window: { fromMs: number; toMs: number }, files: { gaze: string; targets: string }): FileValidation {
  const intervalS = medianIntervalS(gaze);
  if (intervalS === null) throw new QualityFileError(files.gaze, 0, 'needs at least two samples with increasing timestamps to derive the sampling rate');
  const rateHz = 1 / intervalS;
  const samples: TimedSample[] = gaze.map((r) => ({ hostNs: toNs(r.timeS), x: r.x, y: r.y, valid: r.valid }));
  const expected = expectedSampleCount(window.fromMs, window.toMs, rateHz);
  const points = targets.map((t) => {
    if (t.durationS * 1000 < window.toMs) throw new QualityFileError(files.targets, t.line, `the target is shown for ${t.durationS * 1000} ms, less than the sample window's end at ${window.toMs} ms after onset`);
    return pointQuality(t, samplesInWindow(samples, toNs(t.onsetS), window.fromMs, window.toMs), expected, g);
  });
  const accuracies = points.map((p) => p.accuracyDeg).filter((a): a is number => a !== null);
  return {
    points,
    rateHz,
    meanAccuracyDeg: accuracies.length ? accuracies.reduce((a, b) => a + b, 0) / accuracies.length : null,
    maxAccuracyDeg: accuracies.length ? Math.max(...accuracies) : null,
  };
}
