import type { FlashScreening } from '../../contract/schemas/stimuli';
import { flashScreening } from '../../contract/schemas/stimuli';
import type { LookName } from '../../core/render/look-settings';
import { FLASH_ANALYSER_VERSION, LIBRARY_SCREENING, type FlashAnalysis } from '../../core/safety';
import type { FirstRunJob } from '../first-run';
import { writeFileDurably } from '../fs/durable';
import type { JobRunner } from '../jobs';
import type { StimulusStore } from './stimulus-store';
import { screenEventFile } from './screen-event-file';

const LOOKS: readonly LookName[] = ['polarity', 'decay', 'grey'];

/** The stored result of every look's analysis, as flash.json and StimulusMeta.flash hold it. */
export function combineLooks(analyses: readonly FlashAnalysis[], analysedAt: string): FlashScreening {
  const first = analyses[0]!.analysedWith;
  return flashScreening.parse({
    pass: analyses.every((a) => a.pass),
    looks: analyses.map((a) => ({ look: a.analysedWith.look, pass: a.pass, failures: a.failures, frames: a.analysedWith.frames })),
    analysedWith: { speed: first.speed, placement: first.placement, display: first.display, rateHz: first.rateHz, analyserVersion: first.analyserVersion, cellSideDeg: first.cellSideDeg },
    analysedAt,
  });
}

/**
 * Screens library clips for flashing (app/core/safety) with the library's viewing in every
 * look, writes flash.json beside stats.json and sets the clip's `flash` and `mayFlash`
 * (true unless every look passes). Runs as a job after each import or operation, and once
 * at first run for clips never screened or screened by an older analyser.
 */
export class FlashScreeningService {
  constructor(
    private readonly store: StimulusStore,
    private readonly jobs: JobRunner,
    private readonly changed: (ids: string[]) => void,
  ) {}

  /** Starts screening one clip as a job; returns the job id. */
  start(id: string): string {
    return this.jobs.start('flash-check', `Flash screening of ${id}`, async (report) => {
      const result = await this.screen(id, (f) => report(f, 'screening for flashes'));
      return { message: result.pass ? 'no flashing above the thresholds' : `flashing above the thresholds in ${result.looks.filter((l) => !l.pass).map((l) => l.look).join(', ')}`, resultId: id };
    }).id;
  }

  async screen(id: string, report: (fraction: number) => void = () => undefined): Promise<FlashScreening> {
    const files = this.store.files(id);
    const { analyses } = await screenEventFile(files.events, LOOKS, LIBRARY_SCREENING, report);
    const result = combineLooks(analyses, new Date().toISOString());
    await writeFileDurably(files.flash, `${JSON.stringify(result)}\n`);
    // Read the metadata again just before writing, so a rename made meanwhile is kept.
    const meta = await this.store.get(id);
    if (!meta) throw new Error(`stimulus "${id}" left the library during its flash screening`);
    await this.store.writeMeta({ ...meta, flash: result, mayFlash: !result.pass });
    this.changed([id]);
    return result;
  }

  /** The first-run job: screens every clip without a current screening. */
  job(): FirstRunJob {
    return {
      id: 'flash-screening',
      label: 'Screen the library for flashing',
      run: async (report) => {
        const due = (await this.store.list()).filter((m) => m.flash?.analysedWith.analyserVersion !== FLASH_ANALYSER_VERSION);
        for (const [index, meta] of due.entries()) {
          await this.screen(meta.id, (f) => report((index + f) / due.length, `screening ${meta.name}`));
        }
        return due.length === 0 ? 'every clip already screened' : `screened ${due.length} clips`;
      },
    };
  }
}
