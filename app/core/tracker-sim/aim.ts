/**
 * Where the viewer means to look at one instant: a screen position (px) and the identity
 * of the thing looked at. A new key is a new target (a saccade to it is programmed); the
 * same key with a moving position is something to pursue.
 */
export interface Aim {
  readonly key: string;
  readonly x: number;
  readonly y: number;
}

/** Chooses what to look at; asked in time order, once per sample. */
export interface Viewer {
  aimAt(hostS: number): Aim;
}
