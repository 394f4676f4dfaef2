/**
 * The fraction of a movement covered at normalised time τ in [0, 1] by the
 * minimum-jerk profile, 10τ³ − 15τ⁴ + 6τ⁵ (Flash & Hogan 1985, "The coordination of arm
 * movements: an experimentally confirmed mathematical model", J. Neurosci. 5(7):1688-1703).
 * Its velocity is bell-shaped and symmetric, peaking at τ = ½ at 1.875 times the mean
 * velocity; real saccades are a little skewed, which this smooth profile ignores.
 */
export function minimumJerkFraction(tau: number): number {
  if (tau <= 0) return 0;
  if (tau >= 1) return 1;
  return tau * tau * tau * (10 + tau * (-15 + 6 * tau));
}
