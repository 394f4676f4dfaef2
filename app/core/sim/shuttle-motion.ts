/**
 * A back-and-forth run between two positions: constant acceleration for `rampS` at the
 * start and end of each leg, constant `speed` in between (a trapezoidal speed profile,
 * common practice, no source). At `startS` the mover is at rest at `from`.
 */
export interface ShuttleRun {
  readonly from: number;
  readonly to: number;
  /** Cruising speed, units per second. */
  readonly speed: number;
  readonly rampS: number;
  readonly startS: number;
}

export function shuttlePosition(run: ShuttleRun, tS: number): number {
  const distance = Math.abs(run.to - run.from);
  const direction = Math.sign(run.to - run.from);
  const legS = distance / run.speed + run.rampS;
  const phase = mod(tS - run.startS, 2 * legS);
  return phase < legS ? run.from + direction * along(run, legS, phase) : run.to - direction * along(run, legS, phase - legS);
}

/** Distance covered `tau` seconds into a leg lasting `legS`. */
function along(run: ShuttleRun, legS: number, tau: number): number {
  const { speed, rampS } = run;
  if (rampS === 0) return speed * tau;
  const acceleration = speed / rampS;
  if (tau < rampS) return 0.5 * acceleration * tau * tau;
  if (tau < legS - rampS) return 0.5 * speed * rampS + speed * (tau - rampS);
  const left = legS - tau;
  return speed * (legS - rampS) - 0.5 * acceleration * left * left;
}

const mod = (a: number, n: number): number => ((a % n) + n) % n;
