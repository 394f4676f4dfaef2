/**
 * What drives the recorder's flushes: called once with the interval and the tick, returns
 * a way to stop. Live, a real interval timer; in tests and the simulated demo, a timer
 * that the simulation fires itself as its clock advances.
 */
export type FlushTimer = (intervalMs: number, tick: () => void) => { cancel(): void };

export const intervalFlushTimer: FlushTimer = (intervalMs, tick) => {
  const handle = setInterval(tick, intervalMs);
  return { cancel: () => clearInterval(handle) };
};
