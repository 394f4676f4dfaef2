import type { ParticipantRecord, ProtocolRecord, ProtocolStep, RecordOf } from './records';

type StimulusRecord = RecordOf<'stimuli'>;

const stepClips = (s: ProtocolStep): string[] => (s.kind === 'clip' ? [s.stimulusId] : s.kind === 'block' ? s.stimulusIds : []);

/** Every clip a protocol's steps show, once each, in step order. */
export function protocolClips(steps: readonly ProtocolStep[]): string[] {
  return [...new Set(steps.flatMap(stepClips))];
}

/**
 * The clips of a protocol that may flash: those the study's stimulus records mark (the flash
 * analysis failed), with those the protocol recorded when it was saved, so a mark that was
 * later lost from a record still counts.
 */
export function flashingClips(protocol: Pick<ProtocolRecord, 'steps' | 'flashingStimulusIds'>, stimuli: readonly StimulusRecord[]): string[] {
  const marked = new Set(stimuli.filter((s) => s.mayFlash).map((s) => s.id));
  const recorded = new Set(protocol.flashingStimulusIds ?? []);
  return protocolClips(protocol.steps).filter((id) => marked.has(id) || recorded.has(id));
}

/** The protocol as it is to be saved: it records which of its clips may flash. */
export function withFlashRecord(protocol: ProtocolRecord, stimuli: readonly StimulusRecord[]): ProtocolRecord {
  const marked = new Set(stimuli.filter((s) => s.mayFlash).map((s) => s.id));
  const flashing = protocolClips(protocol.steps).filter((id) => marked.has(id));
  const { flashingStimulusIds: _previous, ...rest } = protocol;
  return flashing.length > 0 ? { ...rest, flashingStimulusIds: flashing } : rest;
}

/**
 * The protocol-side rule: a protocol with a clip that may flash runs only participants whose
 * eligibility check cleared photosensitivity. Sentences for the operator; empty when allowed.
 */
export function protocolFlashProblems(protocol: Pick<ProtocolRecord, 'name' | 'steps' | 'flashingStimulusIds'>, participant: ParticipantRecord, stimuli: readonly StimulusRecord[]): string[] {
  const flashing = flashingClips(protocol, stimuli);
  if (flashing.length === 0 || participant.eligibility.photosensitivityCleared) return [];
  const name = (id: string) => `"${stimuli.find((s) => s.id === id)?.name || id}"`;
  return [`The protocol "${protocol.name}" shows clips that may flash (${flashing.map(name).join(', ')}), so it runs only participants cleared in photosensitivity screening.`];
}
