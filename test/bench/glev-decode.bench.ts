import { crc32 as zlibCrc32 } from 'node:zlib';
import { crc32 } from '../../app/core/checksum/crc32';
import { allocateBatch, type EventBatch } from '../../app/core/events/event-batch';
import { decodeGlev, decodeGlevInto, encodeGlev } from '../../app/core/events/glev';
import { Xoshiro128 } from '../../app/core/random/xoshiro128';
import { rate, type Benchmark } from './harness';

const EVENTS = 10_000_000;
const sensor = { width: 640, height: 480 };

/**
 * A fixed camera over a warehouse aisle: a forklift (a 90 x 50 px box) crossing left to
 * right makes most events, the rest are sensor noise anywhere; Poisson arrivals at about
 * 4 M events/s, so many events share a microsecond, as on a real sensor.
 */
function aisleStream(n: number): EventBatch {
  const g = new Xoshiro128(2024);
  const out = allocateBatch(n);
  let clockUs = 1_000_000;
  for (let i = 0; i < n; i++) {
    clockUs += g.nextExponential(4);
    const onForklift = g.next() < 0.75;
    const boxX = Math.floor((clockUs / 5_000) % 550);
    out.t[i] = Math.floor(clockUs);
    out.x[i] = onForklift ? boxX + g.nextInt(90) : g.nextInt(640);
    out.y[i] = onForklift ? 300 + g.nextInt(50) : g.nextInt(480);
    out.p[i] = g.nextInt(2);
  }
  return out;
}

/**
 * Median seconds per call of each step, after two warm-up rounds. The steps take turns
 * round by round, so that a peer and the code it is compared with share the machine's
 * conditions (garbage collection, other load) rather than meeting them in separate phases.
 */
function interleavedMedians(runs: number, steps: readonly (() => void)[]): number[] {
  const times = steps.map(() => [] as number[]);
  for (let r = -2; r < runs; r++) {
    steps.forEach((step, k) => {
      const start = process.hrtime.bigint();
      step();
      if (r >= 0) times[k]!.push(Number(process.hrtime.bigint() - start) / 1e9);
    });
  }
  return times.map((list) => list.sort((a, b) => a - b)[runs >> 1]!);
}

export const benchmark: Benchmark = {
  name: '.glev decode of 10 M events (640x480), against copying the same bytes',
  async run(log) {
    const events = aisleStream(EVENTS);
    const file = encodeGlev(events, { sensor, resolution: 'us' });
    log(`file: ${(file.length / 1e6).toFixed(1)} MB, ${(file.length / EVENTS).toFixed(4)} bytes/event, stream ${((events.t[EVENTS - 1]! - events.t[0]!) / 1e6).toFixed(2)} s`);

    const check = decodeGlev(file, 'aisle.glev');
    if (check.t[EVENTS - 1] !== events.t[EVENTS - 1] || check.y[12_345] !== events.y[12_345]) throw new Error('decode does not match the encoded stream');
    const [copyS, verifiedS, skippedS] = interleavedMedians(9, [
      () => void file.slice(),
      () => void decodeGlev(file, 'aisle.glev'),
      () => void decodeGlev(file, 'aisle.glev', { verifyChecksums: false }),
    ]) as [number, number, number];
    const copy = { name: 'bytes.slice() of the same file', value: EVENTS / copyS / 1e6 };
    log(`copy ${copy.value.toFixed(0)} M events/s equivalent (${(file.length / copyS / 1e9).toFixed(2)} GB/s)`);
    log(`decode, CRC32 verified ${(EVENTS / verifiedS / 1e6).toFixed(0)} M events/s; checksums skipped ${(EVENTS / skippedS / 1e6).toFixed(0)} M events/s`);

    // A player decodes into columns it reuses; the matching peer copies into a reused buffer.
    const reused = allocateBatch(EVENTS);
    const target = new Uint8Array(file.length);
    const [reusedCopyS, reusedVerifiedS, reusedSkippedS] = interleavedMedians(9, [
      () => target.set(file),
      () => void decodeGlevInto(file, 'aisle.glev', reused),
      () => void decodeGlevInto(file, 'aisle.glev', reused, { verifyChecksums: false }),
    ]) as [number, number, number];
    const reusedCopy = { name: 'copy of the same bytes into a reused buffer', value: EVENTS / reusedCopyS / 1e6 };
    log(`into reused columns: CRC32 verified ${(EVENTS / reusedVerifiedS / 1e6).toFixed(0)}, skipped ${(EVENTS / reusedSkippedS / 1e6).toFixed(0)} M events/s; copy ${reusedCopy.value.toFixed(0)}`);

    const [oursS, zlibS] = interleavedMedians(9, [() => void crc32(file), () => void zlibCrc32(file)]) as [number, number];
    if (crc32(file) !== zlibCrc32(file)) throw new Error('crc32 disagrees with zlib');
    log(`crc32 ${(file.length / oursS / 1e9).toFixed(2)} GB/s, zlib.crc32 ${(file.length / zlibS / 1e9).toFixed(2)} GB/s`);

    return [
      rate('.glev decodeGlev, CRC32 verified (10 M events)', EVENTS / verifiedS / 1e6, 'M events/s', copy),
      rate('.glev decodeGlev, checksums skipped (10 M events)', EVENTS / skippedS / 1e6, 'M events/s', copy),
      rate('.glev decode into reused columns, CRC32 verified', EVENTS / reusedVerifiedS / 1e6, 'M events/s', reusedCopy),
      rate('.glev decode into reused columns, checksums skipped', EVENTS / reusedSkippedS / 1e6, 'M events/s', reusedCopy),
      rate('crc32, slicing-by-16 (80 MB)', file.length / oursS / 1e9, 'GB/s', { name: "Node's zlib.crc32", value: file.length / zlibS / 1e9 }),
    ];
  },
};
