/**
 * One ping exchange between a client and a server clock, each time read on the clock of
 * the side that saw it: t1 client send, t2 server receive, t3 server send, t4 client
 * receive. Units are the caller's (milliseconds for the stage), the same in all four.
 */
export interface PingExchange {
  readonly t1: number;
  readonly t2: number;
  readonly t3: number;
  readonly t4: number;
}

export interface PingClockEstimate {
  /** Server clock minus client clock. */
  readonly offset: number;
  /** Round trip spent in transit, the server's turnaround excluded. */
  readonly delay: number;
  /** The true offset lies within offset ± uncertainty whatever the split of the delay between the two directions: delay / 2. */
  readonly uncertainty: number;
  /** Exchanges the estimate was chosen from. */
  readonly samples: number;
}

/**
 * The on-wire offset and delay of one exchange (Mills, 1991, "Internet time
 * synchronization: the Network Time Protocol", IEEE Trans. Commun. 39(10); RFC 5905,
 * section 8): θ = ((t2 − t1) + (t3 − t4)) / 2, δ = (t4 − t1) − (t3 − t2). A δ below zero,
 * which only rounding or skew between the two clocks can give, is taken as 0 (NTP likewise
 * never lets it fall below the clock precision).
 */
export function pingOffsetDelay(exchange: PingExchange): { offset: number; delay: number } {
  for (const key of ['t1', 't2', 't3', 't4'] as const) {
    if (!Number.isFinite(exchange[key])) throw new RangeError(`exchange.${key} must be a finite number, got ${exchange[key]}`);
  }
  const { t1, t2, t3, t4 } = exchange;
  if (t4 < t1) throw new RangeError(`exchange.t4 (${t4}) must not be before exchange.t1 (${t1}): both are client times`);
  if (t3 < t2) throw new RangeError(`exchange.t3 (${t3}) must not be before exchange.t2 (${t2}): both are server times`);
  return { offset: (t2 - t1 + (t3 - t4)) / 2, delay: Math.max(0, t4 - t1 - (t3 - t2)) };
}

/**
 * Server-clock offset from repeated pings, NTP's clock filter (Mills, 1991; RFC 5905,
 * section 10): of the last `keep` exchanges (default 8), the one with the smallest round
 * trip carries the least asymmetry error, so it gives the estimate, and its delay / 2 bounds
 * the error. Ties go to the newer exchange. Keeping only recent exchanges lets the estimate
 * follow a slow skew between the clocks; no skew is fitted.
 */
export class PingClockEstimator {
  private readonly keep: number;
  private readonly offsets: number[] = [];
  private readonly delays: number[] = [];

  constructor(options: { keep?: number } = {}) {
    const keep = options.keep ?? 8;
    if (!(Number.isInteger(keep) && keep >= 1)) throw new RangeError(`keep must be a positive integer, got ${keep}`);
    this.keep = keep;
  }

  add(exchange: PingExchange): void {
    const { offset, delay } = pingOffsetDelay(exchange);
    this.offsets.push(offset);
    this.delays.push(delay);
    if (this.offsets.length > this.keep) {
      this.offsets.shift();
      this.delays.shift();
    }
  }

  /** The minimum-delay exchange of those kept; null before any exchange. */
  estimate(): PingClockEstimate | null {
    let best = -1;
    for (let i = 0; i < this.delays.length; i++) if (best < 0 || this.delays[i]! <= this.delays[best]!) best = i;
    if (best < 0) return null;
    const delay = this.delays[best]!;
    return { offset: this.offsets[best]!, delay, uncertainty: delay / 2, samples: this.delays.length };
  }

  /** A client-clock time on the server clock; null before any exchange. */
  toServer(clientTime: number): number | null {
    const e = this.estimate();
    return e === null ? null : clientTime + e.offset;
  }

  /** A server-clock time on the client clock; null before any exchange. */
  toClient(serverTime: number): number | null {
    const e = this.estimate();
    return e === null ? null : serverTime - e.offset;
  }
}
