import { open, stat } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import type { EventBatch, SensorSize, TimeResolution } from '../../core/events/event-batch';
import { sortByTime } from '../../core/events/ops';
import { TextEventDecoder, type TextTimeUnit } from '../../core/events/text/text-event-decoder';
import { openGlevFile } from './glev-file';
import { decodeTextFile } from './parallel-text-decode';

export interface EventInputOptions {
  readonly timeUnit?: TextTimeUnit;
  readonly sensor?: SensorSize;
  /** Reorder events by time (text only); the whole file is then held in memory. */
  readonly sort?: boolean;
  /** Text files up to this size are decoded whole, in parallel; larger ones are streamed. */
  readonly wholeFileLimitBytes?: number;
}

/** An event file opened for reading, whichever its format: facts first, then events in order. */
export interface EventInput {
  readonly path: string;
  readonly kind: 'glev' | 'text';
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
  readonly sizeBytes: number;
  readonly warnings: readonly string[];
  /** The events in time order. Iterate once. */
  batches(): AsyncIterable<EventBatch>;
  close(): Promise<void>;
}

const STREAM_CHUNK_BYTES = 4 << 20;
const DEFAULT_WHOLE_FILE_LIMIT = 1 << 30;

export const isGlevPath = (path: string): boolean => extname(path).toLowerCase() === '.glev';

/** Overall reading progress in [0, 1], across opening and iterating. */
export type ReadProgress = (fraction: number) => void;

/**
 * Opens a .glev or text event file. Text files that fit comfortably in memory are decoded
 * whole by the parallel decoder while opening; larger ones are streamed chunk by chunk,
 * with a first pass to learn the sensor size when neither the options nor the file state it.
 */
export async function openEventInput(path: string, options: EventInputOptions = {}, onProgress: ReadProgress = () => undefined): Promise<EventInput> {
  const sizeBytes = (await stat(path)).size;
  return isGlevPath(path) ? openGlevInput(path, sizeBytes, options, onProgress) : openTextInput(path, sizeBytes, options, onProgress);
}

async function openGlevInput(path: string, sizeBytes: number, options: EventInputOptions, onProgress: ReadProgress): Promise<EventInput> {
  const file = await openGlevFile(path);
  const warnings: string[] = [];
  const given = options.sensor;
  if (given && (given.width !== file.sensor.width || given.height !== file.sensor.height)) {
    warnings.push(`${basename(path)} states its sensor as ${file.sensor.width}x${file.sensor.height}; the given ${given.width}x${given.height} was not used`);
  }
  if (options.sort) warnings.push('.glev files are always in time order; --sort had nothing to do');
  return {
    path,
    kind: 'glev',
    sensor: file.sensor,
    resolution: file.resolution,
    sizeBytes,
    warnings,
    async *batches() {
      for (let chunk = 0; chunk < file.chunkCount; chunk++) {
        yield await file.readChunk(chunk);
        onProgress((chunk + 1) / file.chunkCount);
      }
    },
    close: () => file.close(),
  };
}

const inferredWarning = (file: string, extent: SensorSize): string =>
  `${file} does not state its sensor size; using ${extent.width}x${extent.height}, the smallest that holds every event (give --width and --height to set it)`;

async function openTextInput(path: string, sizeBytes: number, options: EventInputOptions, onProgress: ReadProgress): Promise<EventInput> {
  const file = basename(path);
  const decoderOptions = { file, timeUnit: options.timeUnit, sensor: options.sensor, allowUnsorted: options.sort === true };
  const whole = options.sort === true || sizeBytes <= (options.wholeFileLimitBytes ?? DEFAULT_WHOLE_FILE_LIMIT);
  if (whole) {
    const decoded = await decodeTextFile(path, decoderOptions, {
      onProgress: ({ bytesDone, bytesTotal }) => onProgress(0.9 * (bytesTotal ? bytesDone / bytesTotal : 1)),
    });
    const sensor = options.sensor ?? decoded.declaredSensor ?? decoded.extent;
    const warnings = options.sensor || decoded.declaredSensor ? [] : [inferredWarning(file, decoded.extent)];
    const batch = options.sort ? sortByTime(decoded.batch) : decoded.batch;
    return {
      path,
      kind: 'text',
      sensor,
      resolution: decoded.resolution,
      sizeBytes,
      warnings,
      async *batches() {
        yield batch;
        onProgress(1);
      },
      close: async () => undefined,
    };
  }
  // Streaming: learn the sensor first when it is not given, by a pass that keeps nothing.
  let sensor = options.sensor ?? null;
  let resolution: TimeResolution = 'us';
  const warnings: string[] = [];
  const share = sensor ? 0 : 0.5; // the first pass, when needed, is half the work
  if (!sensor) {
    const probe = new TextEventDecoder(decoderOptions);
    let read = 0;
    for await (const bytes of readChunks(path)) {
      probe.push(bytes);
      read += bytes.byteLength;
      onProgress(share * (read / sizeBytes));
    }
    probe.end();
    sensor = probe.declaredSensor ?? probe.extent;
    resolution = probe.resolution;
    if (!probe.declaredSensor) warnings.push(inferredWarning(file, probe.extent));
  } else {
    const probe = new TextEventDecoder(decoderOptions);
    for await (const bytes of readChunks(path, 64 << 10)) {
      probe.push(bytes);
      break;
    }
    resolution = probe.resolution;
  }
  const streamSensor = sensor;
  return {
    path,
    kind: 'text',
    sensor: streamSensor,
    resolution,
    sizeBytes,
    warnings,
    async *batches() {
      const decoder = new TextEventDecoder({ ...decoderOptions, sensor: streamSensor });
      let done = 0;
      for await (const bytes of readChunks(path)) {
        done += bytes.byteLength;
        const batch = decoder.push(bytes);
        if (batch.t.length > 0) yield batch;
        onProgress(share + (1 - share) * (done / sizeBytes));
      }
      const last = decoder.end();
      if (last.t.length > 0) yield last;
    },
    close: async () => undefined,
  };
}

async function* readChunks(path: string, chunkBytes = STREAM_CHUNK_BYTES): AsyncGenerator<Uint8Array> {
  const handle = await open(path, 'r');
  try {
    for (;;) {
      const buffer = new Uint8Array(chunkBytes);
      const { bytesRead } = await handle.read(buffer, 0, chunkBytes, null);
      if (bytesRead === 0) return;
      yield buffer.subarray(0, bytesRead);
    }
  } finally {
    await handle.close();
  }
}
