import { open, readFile, type FileHandle } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import { basename } from 'node:path';
import { concatBatches, sliceBatch, type EventBatch, type SensorSize, type TimeResolution } from '../../core/events/event-batch';
import { EventFormatError } from '../../core/events/event-format-error';
import { mergeTextRanges } from '../../core/events/text/merge-text-ranges';
import { checkTextDecoderOptions, type TextDecoderOptions } from '../../core/events/text/text-decoder-options';
import { TextEventDecoder } from '../../core/events/text/text-event-decoder';
import { textFaultError } from '../../core/events/text/text-fault-error';
import { readTextLayout, type TextFormat, type TextLayout } from '../../core/events/text/text-layout';
import { textRangeConfig } from '../../core/events/text/text-range-config';
import { newTextRangeState } from '../../core/events/text/text-range-types';
import { TIME_UNITS } from '../../core/events/text/text-time-unit';
import type { TextWorkerJob } from './text-worker';
import { textWorkerPool } from './text-worker-pool';

export interface TextFileOptions extends Omit<TextDecoderOptions, 'file'> {
  /** The name messages use; the file's base name by default. */
  readonly file?: string;
}

export interface TextDecodeProgress {
  readonly bytesDone: number;
  readonly bytesTotal: number;
}

export interface TextFileRun {
  /** Worker threads to decode with; 0 decodes on this thread. By default one per core for files of 8 MiB or more. */
  readonly workers?: number;
  readonly onProgress?: (progress: TextDecodeProgress) => void;
}

export interface DecodedTextFile {
  /** The events. Decoded by workers, the columns are views of SharedArrayBuffers. */
  readonly batch: EventBatch;
  readonly format: TextFormat;
  readonly resolution: TimeResolution;
  readonly declaredSensor: SensorSize | null;
  /** The smallest sensor that holds every event (max x + 1, max y + 1). */
  readonly extent: SensorSize;
  readonly eventCount: number;
  readonly lineCount: number;
}

const PARALLEL_FROM_BYTES = 8 << 20;
const PIECE_BYTES = 1 << 20;

/**
 * Decodes a whole text event file (one that fits in memory) into one batch. Large files
 * are cut at line boundaries after the header into one range per worker; each worker
 * reads and decodes its range into its share of shared output columns, and the ranges'
 * line counts and boundary checks are joined here, so a fault names the same line and
 * the time order is checked the same as when one decoder reads the whole file.
 */
export async function decodeTextFile(path: string, options: TextFileOptions = {}, run: TextFileRun = {}): Promise<DecodedTextFile> {
  const decoderOptions: TextDecoderOptions = { ...options, file: options.file ?? basename(path) };
  checkTextDecoderOptions(decoderOptions);
  if (run.workers !== undefined && !(Number.isInteger(run.workers) && run.workers >= 0)) throw new RangeError(`workers must be a whole number, got ${run.workers}`);
  const handle = await open(path, 'r');
  let size: number;
  let head: { layout: TextLayout; sample: Uint8Array };
  let cuts: number[];
  try {
    size = (await handle.stat()).size;
    head = await readHead(handle, size, decoderOptions);
    const workers = run.workers ?? (size - head.layout.bodyByte >= PARALLEL_FROM_BYTES ? Math.min(availableParallelism(), 8) : 0);
    if (workers === 0) return await decodeHere(path, decoderOptions, run.onProgress);
    cuts = await cutAtLines(handle, head.layout.bodyByte, size, workers);
  } finally {
    await handle.close();
  }
  return decodeInWorkers(path, decoderOptions, head.layout, head.sample, cuts, size, run.onProgress);
}

async function decodeHere(path: string, options: TextDecoderOptions, onProgress: TextFileRun['onProgress']): Promise<DecodedTextFile> {
  const bytes = await readFile(path);
  const decoder = new TextEventDecoder(options);
  const batch = concatBatches([decoder.push(bytes), decoder.end()]);
  onProgress?.({ bytesDone: bytes.length, bytesTotal: bytes.length });
  const { format, resolution, declaredSensor, extent, eventCount, lineCount } = decoder;
  return { batch, format: format!, resolution, declaredSensor, extent, eventCount, lineCount };
}

/** The layout, from as much of the start of the file as it takes, and that start as a sample of the lines. */
async function readHead(handle: FileHandle, size: number, options: TextDecoderOptions): Promise<{ layout: TextLayout; sample: Uint8Array }> {
  for (let length = Math.min(size, 1 << 16); ; length = Math.min(size, length * 4)) {
    const sample = new Uint8Array(length);
    await readFully(handle, sample, 0);
    const layout = readTextLayout(sample, length === size, options);
    if (layout === 'empty') throw new EventFormatError(options.file, '', 'no events');
    if (layout) return { layout, sample };
  }
}

async function readFully(handle: FileHandle, into: Uint8Array, position: number): Promise<void> {
  for (let got = 0; got < into.length; ) {
    const { bytesRead } = await handle.read(into, got, into.length - got, position + got);
    if (bytesRead === 0) throw new Error('the file became shorter while it was read');
    got += bytesRead;
  }
}

/** Range starts: `from`, then just after the first newline at or past each equal share, then `size`. */
async function cutAtLines(handle: FileHandle, from: number, size: number, parts: number): Promise<number[]> {
  const cuts = [from];
  const window = new Uint8Array(1 << 16);
  for (let k = 1; k < parts; k++) {
    let at = Math.max(cuts.at(-1)!, from + Math.floor(((size - from) * k) / parts));
    for (;;) {
      const length = Math.min(window.length, size - at);
      if (length <= 0) break;
      const view = window.subarray(0, length);
      await readFully(handle, view, at);
      const newline = view.indexOf(10);
      if (newline >= 0) {
        at += newline + 1;
        break;
      }
      at += length;
    }
    if (at < size) cuts.push(at);
  }
  cuts.push(size);
  return cuts;
}

async function decodeInWorkers(
  path: string,
  options: TextDecoderOptions,
  layout: TextLayout,
  sample: Uint8Array,
  cuts: readonly number[],
  size: number,
  onProgress: TextFileRun['onProgress'],
): Promise<DecodedTextFile> {
  const config = textRangeConfig(layout, options.allowUnsorted ?? false);
  let sampleLines = 0;
  for (let k = layout.bodyByte; k < sample.length; k++) if (sample[k] === 10) sampleLines++;
  const lineBytes = sampleLines > 0 ? (sample.length - layout.bodyByte) / sampleLines : 16;
  // Each range's share of the output: its bytes over the mean line length, with a margin.
  const shares = cuts.slice(1).map((to, k) => Math.ceil(((to - cuts[k]!) / lineBytes) * 1.02) + 1024);
  const total = shares.reduce((a, b) => a + b, 0);
  const columns = { t: new SharedArrayBuffer(total * 8), x: new SharedArrayBuffer(total * 2), y: new SharedArrayBuffer(total * 2), p: new SharedArrayBuffer(total) };
  let outStart = 0;
  const jobs: TextWorkerJob[] = shares.map((share, k) => {
    const job = { path, from: cuts[k]!, to: cuts[k + 1]!, config, state: newTextRangeState(0), columns, outStart, outEnd: outStart + share, pieceBytes: PIECE_BYTES };
    outStart += share;
    return job;
  });
  let bytesDone = layout.bodyByte;
  const results = await textWorkerPool.run(jobs, (bytes) => {
    bytesDone += bytes;
    onProgress?.({ bytesDone, bytesTotal: size });
  });

  const merged = mergeTextRanges(
    results.map((r) => r.state),
    layout.bodyLine,
    config,
  );
  if (merged.fault) throw textFaultError(options.file, layout, merged.fault, merged.faultRange === null ? '' : results[merged.faultRange]!.faultText);
  if (merged.events === 0) throw new EventFormatError(options.file, '', 'no events');

  const shared: EventBatch = { t: new Float64Array(columns.t), x: new Uint16Array(columns.x), y: new Uint16Array(columns.y), p: new Uint8Array(columns.p) };
  const parts = results.flatMap((r, k) => [sliceBatch(shared, jobs[k]!.outStart, jobs[k]!.outStart + r.inShared), ...(r.spill ? [r.spill] : [])]);
  const batch = results.some((r) => r.spill) ? concatBatches(parts) : compact(shared, parts);
  return {
    batch,
    format: layout.format,
    resolution: TIME_UNITS[layout.unit].resolution,
    declaredSensor: layout.declaredSensor,
    extent: { width: merged.maxX + 1, height: merged.maxY + 1 },
    eventCount: merged.events,
    lineCount: merged.lines,
  };
}

/** Moves each range's events down to follow the previous range's, in place. */
function compact(shared: EventBatch, parts: readonly EventBatch[]): EventBatch {
  let n = 0;
  for (const part of parts) {
    const start = part.t.byteOffset / 8;
    const length = part.t.length;
    if (start !== n) {
      shared.t.copyWithin(n, start, start + length);
      shared.x.copyWithin(n, start, start + length);
      shared.y.copyWithin(n, start, start + length);
      shared.p.copyWithin(n, start, start + length);
    }
    n += length;
  }
  return sliceBatch(shared, 0, n);
}
