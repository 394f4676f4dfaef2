import type { FlushTimer } from '../../../app/host/recording/flush-timer';

/** A flush timer the test fires itself, as the simulated demo does when its clock advances. */
export function manualTimer(): { readonly timer: FlushTimer; fire(): void; readonly intervalMs: number | null; readonly cancelled: boolean } {
  let tick: (() => void) | null = null;
  let intervalMs: number | null = null;
  let cancelled = false;
  return {
    timer: (ms, t) => {
      intervalMs = ms;
      tick = t;
      return { cancel: () => (cancelled = true) };
    },
    fire: () => tick?.(),
    get intervalMs() {
      return intervalMs;
    },
    get cancelled() {
      return cancelled;
    },
  };
}
