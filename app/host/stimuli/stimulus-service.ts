import type { EventBatch } from '../../core/events/event-batch';
import { sliceBatch } from '../../core/events/event-batch';
import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import type { z } from 'zod';
import { parseTracksTsv } from '../../core/tracker-sim';
import type { eventWindowRequest, ImportRequest, operateRequest, StimulusMeta } from '../../contract/schemas/stimuli';
import { openEventInput } from '../events/event-input';
import { openGlevFile, type GlevFile } from '../events/glev-file';
import type { JobRunner } from '../jobs';
import { derivationFor } from './derive-stimulus';
import { stimulusIdFor, type StimulusStore } from './stimulus-store';
import { nameFromPath, writeStimulus } from './stimulus-writer';

const DEFAULT_WINDOW_EVENTS = 2_000_000;

/**
 * Ground-truth tracks travel beside their events as NAME.tracks.tsv (what `events simulate
 * --tracks` writes when given that name); they are checked and kept with the stimulus.
 */
async function siblingTracks(eventsPath: string): Promise<string | null> {
  const path = eventsPath.replace(/\.[^./\\]+$/, '') + '.tracks.tsv';
  const text = await readFile(path, 'utf8').catch(() => null);
  if (text !== null) parseTracksTsv(text, basename(path));
  return text;
}
const MAX_OPEN_READERS = 8;

/**
 * The library's long work: imports and derived stimuli run as jobs; previews read time
 * windows of a stimulus's events.glev (kept open while in use).
 */
export class StimulusService {
  private readonly open = new Map<string, Promise<GlevFile>>();

  constructor(
    private readonly store: StimulusStore,
    private readonly jobs: JobRunner,
    private readonly changed: (ids: string[]) => void,
    /** Called with each new stimulus's id once it is in the library (the flash screening). */
    private readonly added: (id: string) => void = () => undefined,
  ) {}

  startImport(request: ImportRequest): string {
    const name = request.name?.trim() || nameFromPath(request.path);
    return this.jobs.start('import', `Import ${name}`, async (report) => {
      const tracksTsv = await siblingTracks(request.path);
      const input = await openEventInput(request.path, { timeUnit: request.timeUnit, sensor: request.sensor, sort: request.sort }, (f) => report(f, 'reading events'));
      try {
        const meta = await writeStimulus(
          this.store,
          {
            id: stimulusIdFor(name),
            name,
            source: { kind: 'import', file: request.path },
            sensor: input.sensor,
            resolution: input.resolution,
            // Counts as flashing until its screening has run.
            mayFlash: true,
            demo: false,
            warnings: input.warnings,
            ...(tracksTsv ? { tracksTsv: () => tracksTsv } : {}),
          },
          input.batches(),
        );
        this.changed([meta.id]);
        this.added(meta.id);
        return { message: `imported ${meta.eventCount.toLocaleString('en-GB')} events${input.warnings.length ? ` (${input.warnings.join('; ')})` : ''}`, resultId: meta.id };
      } finally {
        await input.close();
      }
    }).id;
  }

  startOperation(request: z.infer<typeof operateRequest>): string {
    return this.jobs.start(request.apply.operation, `${request.apply.operation} ${request.id}`, async (report) => {
      const parent = await this.store.get(request.id);
      if (!parent) throw new Error(`no stimulus "${request.id}" in the library`);
      const derivation = derivationFor(parent, await this.store.stats(request.id), request.apply);
      const name = request.name?.trim() || `${parent.name}, ${derivation.describe}`;
      const input = await openEventInput(this.store.files(parent.id).events, {}, (f) => report(f, derivation.describe));
      try {
        async function* transformed(): AsyncGenerator<EventBatch> {
          for await (const batch of input.batches()) yield derivation.transform(batch);
        }
        const meta = await writeStimulus(
          this.store,
          {
            id: stimulusIdFor(name),
            name,
            source: { kind: 'operation', parentId: parent.id, operation: request.apply.operation, parameters: derivation.parameters },
            sensor: derivation.sensor,
            resolution: parent.resolution,
            mayFlash: true,
            demo: false,
            warnings: [],
          },
          transformed(),
        );
        this.changed([meta.id]);
        this.added(meta.id);
        return { message: `${derivation.describe}: ${meta.eventCount.toLocaleString('en-GB')} events`, resultId: meta.id };
      } finally {
        await input.close();
      }
    }).id;
  }

  /** Events with fromUs <= t < toUs; when there are more than maxEvents, the latest ones (nearest toUs) are kept. */
  async readWindow(request: z.infer<typeof eventWindowRequest>): Promise<{ events: EventBatch; truncated: boolean } | null> {
    const meta: StimulusMeta | null = await this.store.get(request.id);
    if (!meta) return null;
    const file = await this.reader(meta.id);
    const events = await file.readRange(request.fromUs, request.toUs);
    const limit = request.maxEvents ?? DEFAULT_WINDOW_EVENTS;
    const n = events.t.length;
    return n > limit ? { events: sliceBatch(events, n - limit, n), truncated: true } : { events, truncated: false };
  }

  /** Closes the reader of a stimulus that was removed or replaced. */
  async forget(id: string): Promise<void> {
    const file = this.open.get(id);
    this.open.delete(id);
    if (file) await (await file).close();
  }

  private reader(id: string): Promise<GlevFile> {
    let file = this.open.get(id);
    if (file) {
      this.open.delete(id); // re-insert: the Map's order is the least recently used first
    } else {
      file = openGlevFile(this.store.files(id).events);
      file.catch(() => this.open.delete(id));
      const oldest = this.open.keys().next();
      if (this.open.size >= MAX_OPEN_READERS && !oldest.done) void this.forget(oldest.value);
    }
    this.open.set(id, file);
    return file;
  }
}
