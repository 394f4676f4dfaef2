import type { StimulusMeta } from '../../../app/contract';
import type { RecordOf, StudyRecord } from '../../../app/core/study/records';

type StimulusRecord = RecordOf<'stimuli'>;

/** A study's record of a library stimulus: the record id is the library id, so protocols and playback name the same clip. */
export function stimulusFromLibrary(study: StudyRecord, meta: StimulusMeta, addedAt: string): StimulusRecord {
  return { id: meta.id, studyId: study.id, name: meta.name, durationS: meta.durationS, sensor: { width: meta.sensor.width, height: meta.sensor.height }, mayFlash: meta.mayFlash, addedAt };
}

/**
 * The study's records whose library entry changed (flash mark, name, duration, size), as
 * they should now read. The library is the source of truth for the flash mark: a clip
 * marked "may flash" there must never be shown to someone not cleared for it.
 */
export function staleStimuli(records: readonly StimulusRecord[], library: readonly StimulusMeta[]): StimulusRecord[] {
  const byId = new Map(library.map((meta) => [meta.id, meta]));
  return records.flatMap((record) => {
    const meta = byId.get(record.id);
    if (!meta) return [];
    const fresh = { ...record, name: meta.name, durationS: meta.durationS, sensor: { width: meta.sensor.width, height: meta.sensor.height }, mayFlash: meta.mayFlash };
    return JSON.stringify(fresh) === JSON.stringify(record) ? [] : [fresh];
  });
}
