import { basename } from 'node:path';
import type { EventBatch, SensorSize, TimeResolution } from '../../core/events/event-batch';
import { EventStatsAccumulator } from '../../core/events/stats';
import type { EventStats, StimulusMeta } from '../../contract/schemas/stimuli';
import { writeFileDurably } from '../fs/durable';
import { writeGlevFile } from '../events/glev-file';
import type { StimulusStore } from './stimulus-store';

export interface NewStimulus {
  readonly id: string;
  readonly name: string;
  readonly notes?: string;
  readonly source: StimulusMeta['source'];
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
  readonly mayFlash: boolean;
  readonly demo: boolean;
  readonly warnings: readonly string[];
  /** Ground-truth tracks (simulated clips): TSV text written as tracks.tsv. */
  readonly tracksTsv?: () => string;
}

/**
 * Builds a stimulus in a staging folder (events.glev, stats.json, meta.json, tracks.tsv)
 * while the events stream through once, then publishes it into the library. On any
 * failure the staging folder is removed and the library is exactly as before.
 */
export async function writeStimulus(store: StimulusStore, spec: NewStimulus, batches: AsyncIterable<EventBatch> | Iterable<EventBatch>): Promise<StimulusMeta> {
  const staging = await store.stage();
  try {
    const stats = new EventStatsAccumulator(spec.sensor);
    async function* counted(): AsyncGenerator<EventBatch> {
      for await (const batch of batches) {
        stats.push(batch);
        yield batch;
      }
    }
    await writeGlevFile(`${staging}/events.glev`, { sensor: spec.sensor, resolution: spec.resolution }, counted());
    const figures: EventStats = stats.finish();
    if (figures.count === 0) throw new Error(`${spec.name}: no events to store`);
    if (spec.tracksTsv) await writeFileDurably(`${staging}/tracks.tsv`, spec.tracksTsv());
    const meta: StimulusMeta = {
      id: spec.id,
      name: spec.name,
      notes: spec.notes ?? '',
      createdAt: new Date().toISOString(),
      source: spec.source,
      sensor: { width: spec.sensor.width, height: spec.sensor.height },
      resolution: spec.resolution,
      eventCount: figures.count,
      tStartUs: figures.t_start_us ?? 0,
      tEndUs: figures.t_end_us ?? 0,
      durationS: figures.duration_s,
      mayFlash: spec.mayFlash,
      demo: spec.demo,
      hasTracks: spec.tracksTsv !== undefined,
      warnings: [...spec.warnings],
    };
    await store.writeStats(figures, staging);
    await store.writeMeta(meta, staging);
    await store.publish(staging, spec.id);
    return meta;
  } catch (error) {
    await store.discard(staging);
    throw error;
  }
}

/** "aisle-run.csv" -> "aisle-run". */
export const nameFromPath = (path: string): string => basename(path).replace(/\.[^.]+$/, '') || basename(path);
