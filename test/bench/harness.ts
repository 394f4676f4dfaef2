/**
 * One row of bench/results.json. `ratio` is always "times better than the peer": for
 * rates it is value / peer_value, for durations peer_value / value, so above 1 means
 * Gazeloom is ahead of its peer. Peer fields are null where no peer exists.
 */
export interface BenchEntry {
  readonly name: string;
  readonly value: number;
  readonly unit: string;
  readonly peer: string | null;
  readonly peer_value: number | null;
  readonly ratio: number | null;
}

export interface Benchmark {
  readonly name: string;
  run(log: (line: string) => void): Promise<BenchEntry[]>;
}

export function rate(name: string, value: number, unit: string, peer?: { name: string; value: number }): BenchEntry {
  return { name, value, unit, peer: peer?.name ?? null, peer_value: peer?.value ?? null, ratio: peer ? value / peer.value : null };
}

export function duration(name: string, value: number, unit: string, peer?: { name: string; value: number }): BenchEntry {
  return { name, value, unit, peer: peer?.name ?? null, peer_value: peer?.value ?? null, ratio: peer ? peer.value / value : null };
}

/** Runs `step` repeatedly for about `seconds` and returns operations per second. */
export async function opsPerSecond(seconds: number, step: () => Promise<void>): Promise<number> {
  for (let i = 0; i < 50; i++) await step(); // warm up
  const start = process.hrtime.bigint();
  const budget = BigInt(Math.round(seconds * 1e9));
  let count = 0;
  while (process.hrtime.bigint() - start < budget) {
    await step();
    count++;
  }
  return count / (Number(process.hrtime.bigint() - start) / 1e9);
}
