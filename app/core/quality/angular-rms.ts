/**
 * The arithmetic every data-quality measure shares, whatever space the positions are in:
 * degrees on a flat plane (the worked examples) or screen pixels seen from the eye (live
 * gaze). Each measure takes `angle(a, b)`, the angular distance between two positions in
 * degrees, so the same code serves both (Holmqvist, Nyström and Mulvey 2012, "Eye tracker
 * data quality: what it is and how to measure it", Proc. ETRA, pp. 45–52).
 */
export interface Position {
  readonly x: number;
  readonly y: number;
}

export type AngleDeg<P extends Position> = (a: P, b: P) => number;

/** √(mean v²) of the values; NaN for none. */
export function rootMeanSquare(values: readonly number[]): number {
  if (values.length === 0) return Number.NaN;
  let sum = 0;
  for (const v of values) sum += v * v;
  return Math.sqrt(sum / values.length);
}

/** The mean of the positions' coordinates; null for none. */
export function meanPosition(points: readonly Position[]): Position | null {
  if (points.length === 0) return null;
  let sx = 0;
  let sy = 0;
  for (const p of points) {
    sx += p.x;
    sy += p.y;
  }
  return { x: sx / points.length, y: sy / points.length };
}

/**
 * RMS of the angles between successive samples (RMS-S2S). `null` marks an invalid sample:
 * a pair is used only when both of its samples are valid, so no distance is measured
 * across a blink or a lost stretch. NaN when no pair is left.
 */
export function rmsSampleToSample<P extends Position>(samples: readonly (P | null)[], angle: AngleDeg<P>): number {
  const steps: number[] = [];
  for (let i = 1; i < samples.length; i++) {
    const a = samples[i - 1];
    const b = samples[i];
    if (a && b) steps.push(angle(a, b));
  }
  return rootMeanSquare(steps);
}

/** RMS of each sample's angle from the centre (population form: divides by n). NaN for no samples. */
export function rmsAround<P extends Position>(samples: readonly P[], centre: P, angle: AngleDeg<P>): number {
  return rootMeanSquare(samples.map((p) => angle(p, centre)));
}
