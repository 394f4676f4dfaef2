import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rename, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { eventStats, stimulusMeta, type EventStats, type StimulusMeta } from '../../contract/schemas/stimuli';
import { publishDirectory, writeFileDurably } from '../fs/durable';
import type { HostLog } from '../log';

const idPattern = /^[a-z0-9][a-z0-9-]{0,79}$/;

export const isStimulusId = (id: string): boolean => idPattern.test(id);

/** A readable, unique, path-safe id from a name: "Forklift crossing" -> "forklift-crossing-3f9a". */
export function stimulusIdFor(name: string): string {
  const slug = name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${slug || 'stimulus'}-${randomBytes(3).toString('hex')}`;
}

export interface StimulusFiles {
  readonly dir: string;
  readonly events: string;
  readonly meta: string;
  readonly stats: string;
  readonly tracks: string;
  /** The flash screening's result (flash-screening.ts). */
  readonly flash: string;
}

/**
 * The stimulus library on disk: one folder per stimulus under <data>/stimuli, holding
 * events.glev, meta.json, stats.json, flash.json (once screened) and (for simulated clips)
 * tracks.tsv. New stimuli are built in a staging folder and renamed into place when
 * complete, so a failed import leaves the library exactly as it was. Removal moves a folder to .trash so it can be undone.
 */
export class StimulusStore {
  readonly root: string;

  constructor(
    dataDir: string,
    private readonly log: HostLog,
  ) {
    this.root = join(dataDir, 'stimuli');
  }

  files(id: string): StimulusFiles {
    if (!isStimulusId(id)) throw new RangeError(`not a stimulus id: "${id}"`);
    const dir = join(this.root, id);
    return { dir, events: join(dir, 'events.glev'), meta: join(dir, 'meta.json'), stats: join(dir, 'stats.json'), tracks: join(dir, 'tracks.tsv'), flash: join(dir, 'flash.json') };
  }

  async list(): Promise<StimulusMeta[]> {
    await mkdir(this.root, { recursive: true });
    const names = (await readdir(this.root, { withFileTypes: true })).filter((e) => e.isDirectory() && isStimulusId(e.name)).map((e) => e.name);
    const metas = await Promise.all(names.map((id) => this.get(id)));
    return metas.filter((m): m is StimulusMeta => m !== null).sort((a, b) => a.name.localeCompare(b.name));
  }

  /** The stimulus's metadata, or null when it is missing or unreadable (logged). */
  async get(id: string): Promise<StimulusMeta | null> {
    if (!isStimulusId(id)) return null;
    const file = this.files(id).meta;
    let text: string;
    try {
      text = await readFile(file, 'utf8');
    } catch {
      return null;
    }
    const parsed = stimulusMeta.safeParse(safeJson(text));
    if (!parsed.success) {
      this.log.warn('stimuli.unreadable_meta', { file, message: parsed.error.issues[0]?.message });
      return null;
    }
    return parsed.data;
  }

  async stats(id: string): Promise<EventStats | null> {
    const text = await readFile(this.files(id).stats, 'utf8').catch(() => null);
    const parsed = text === null ? null : eventStats.safeParse(safeJson(text));
    return parsed?.success ? parsed.data : null;
  }

  /** A fresh staging folder; publish() moves it into the library under its id. */
  async stage(): Promise<string> {
    const staging = join(this.root, '.incoming', randomBytes(6).toString('hex'));
    await mkdir(staging, { recursive: true });
    return staging;
  }

  async publish(staging: string, id: string): Promise<void> {
    await publishDirectory(staging, this.files(id).dir);
  }

  async discard(staging: string): Promise<void> {
    await rm(staging, { recursive: true, force: true });
  }

  async writeMeta(meta: StimulusMeta, dir = this.files(meta.id).dir): Promise<void> {
    await writeFileDurably(join(dir, 'meta.json'), `${JSON.stringify(stimulusMeta.parse(meta), null, 2)}\n`);
  }

  async writeStats(stats: EventStats, dir: string): Promise<void> {
    await writeFileDurably(join(dir, 'stats.json'), `${JSON.stringify(eventStats.parse(stats))}\n`);
  }

  /** Moves a stimulus to .trash (replacing an older removal of the same id); restore() brings it back. */
  async remove(id: string): Promise<void> {
    const trashed = this.trashed(id);
    await mkdir(join(this.root, '.trash'), { recursive: true });
    await rm(trashed, { recursive: true, force: true });
    await rename(this.files(id).dir, trashed);
  }

  async restore(id: string): Promise<boolean> {
    try {
      await rename(this.trashed(id), this.files(id).dir);
      return true;
    } catch {
      return false;
    }
  }

  private trashed(id: string): string {
    return join(this.root, '.trash', this.files(id).dir.slice(this.root.length + 1));
  }
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
