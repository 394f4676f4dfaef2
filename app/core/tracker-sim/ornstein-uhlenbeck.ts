import type { Xoshiro128 } from '../random/xoshiro128';

/**
 * A stationary Ornstein-Uhlenbeck process (mean 0, standard deviation sd, time constant
 * tau), advanced by its exact update x ← x·e^(−dt/τ) + sd·√(1 − e^(−2dt/τ))·N(0, 1)
 * (Gillespie 1996, "Exact numerical simulation of the Ornstein-Uhlenbeck process and its
 * integral", Phys. Rev. E 54(2):2084-2091), so any sampling rate gives the same process.
 * One Gaussian is drawn per step even when sd is 0, so the generator's stream stays aligned.
 */
export class OrnsteinUhlenbeck {
  value = 0;

  constructor(
    private readonly sd: number,
    private readonly tauS: number,
    private readonly rng: Xoshiro128,
  ) {}

  step(dtS: number): number {
    const decay = Math.exp(-dtS / this.tauS);
    this.value = this.value * decay + this.sd * Math.sqrt(1 - decay * decay) * this.rng.nextGaussian();
    return this.value;
  }
}
