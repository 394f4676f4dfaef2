import type { HostClock } from '../../core/clock/host-clock';
import { intervalFlushTimer, type FlushTimer } from './flush-timer';

export interface RecorderOptions {
  readonly clock: HostClock;
  /**
   * The host clock's zero on the machine's monotonic clock (createMonotonicClock().originNs),
   * so that a session resumed by a new process lines its host times up exactly with the old.
   */
  readonly clockOriginNs?: bigint | null;
  /** How often pending records are sealed into chunks and written: 1..100 ms, default 50. */
  readonly flushIntervalMs?: number;
  /** fsync after every Nth flush (default 1); 0 syncs only in flush() and close() (simulated time). */
  readonly syncEveryFlushes?: number;
  /** A stream's chunk is sealed early when it reaches this many records: 1..65534, default 4096. */
  readonly maxRecordsPerChunk?: number;
  readonly timer?: FlushTimer;
  readonly wallClock?: () => Date;
  /** Told of every failed background write or sync (they are retried at the next flush). */
  readonly onError?: (error: Error) => void;
}

export interface RecorderSettings {
  readonly clock: HostClock;
  readonly clockOriginNs: bigint | null;
  readonly flushIntervalMs: number;
  readonly syncEveryFlushes: number;
  readonly maxRecordsPerChunk: number;
  readonly timer: FlushTimer;
  readonly wallClock: () => Date;
  readonly onError: (error: Error) => void;
}

/** The options with their defaults, checked: a RangeError names the first one out of range. */
export function recorderSettings(o: RecorderOptions): RecorderSettings {
  const flushIntervalMs = o.flushIntervalMs ?? 50;
  const syncEveryFlushes = o.syncEveryFlushes ?? 1;
  const maxRecordsPerChunk = o.maxRecordsPerChunk ?? 4096;
  if (!(flushIntervalMs >= 1 && flushIntervalMs <= 100)) throw new RangeError(`flushIntervalMs must be from 1 to 100, got ${flushIntervalMs}`);
  if (!(Number.isInteger(syncEveryFlushes) && syncEveryFlushes >= 0)) throw new RangeError(`syncEveryFlushes must be an integer >= 0, got ${syncEveryFlushes}`);
  if (!(Number.isInteger(maxRecordsPerChunk) && maxRecordsPerChunk >= 1 && maxRecordsPerChunk <= 65534)) throw new RangeError(`maxRecordsPerChunk must be an integer from 1 to 65534, got ${maxRecordsPerChunk}`);
  return {
    clock: o.clock,
    clockOriginNs: o.clockOriginNs ?? null,
    flushIntervalMs,
    syncEveryFlushes,
    maxRecordsPerChunk,
    timer: o.timer ?? intervalFlushTimer,
    wallClock: o.wallClock ?? (() => new Date()),
    onError: o.onError ?? (() => undefined),
  };
}
