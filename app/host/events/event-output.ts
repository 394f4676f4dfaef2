import { open, rename, rm } from 'node:fs/promises';
import { dirname, extname } from 'node:path';
import { csvPreamble, csvRows } from '../../core/events/csv-encode';
import type { EventBatch, SensorSize, TimeResolution } from '../../core/events/event-batch';
import { syncDirectory, temporarySibling } from '../fs/durable';
import { writeGlevFile } from './glev-file';

export interface EventOutputOptions {
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
}

export const outputFormats = ['.glev', '.csv'] as const;

/** The output format from the file's extension, or null when Gazeloom does not write it. */
export function outputFormatOf(path: string): (typeof outputFormats)[number] | null {
  const ext = extname(path).toLowerCase();
  return (outputFormats as readonly string[]).includes(ext) ? (ext as (typeof outputFormats)[number]) : null;
}

/**
 * Writes events to .glev or .csv (by extension), all or nothing: a temporary sibling is
 * written, fsynced and renamed over the target. Returns the number of events written.
 */
export async function writeEventFile(path: string, options: EventOutputOptions, batches: AsyncIterable<EventBatch> | Iterable<EventBatch>): Promise<number> {
  const format = outputFormatOf(path);
  if (format === null) throw new RangeError(`${path}: the output must end in ${outputFormats.join(' or ')}`);
  if (format === '.glev') return (await writeGlevFile(path, options, batches)).eventCount;
  const temporary = temporarySibling(path);
  const handle = await open(temporary, 'wx');
  let closed = false;
  try {
    let count = 0;
    await handle.write(csvPreamble(options.sensor, options.resolution));
    for await (const batch of batches) {
      await handle.write(csvRows(batch, options.resolution));
      count += batch.t.length;
    }
    await handle.sync();
    await handle.close();
    closed = true;
    await rename(temporary, path);
    await syncDirectory(dirname(path));
    return count;
  } catch (error) {
    if (!closed) await handle.close();
    await rm(temporary, { force: true });
    throw error;
  }
}
