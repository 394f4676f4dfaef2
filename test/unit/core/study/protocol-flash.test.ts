import { describe, expect, it } from 'vitest';
import { checkEligibility } from '../../../../app/core/study/eligibility';
import { flashingClips, protocolClips, protocolFlashProblems, withFlashRecord } from '../../../../app/core/study/protocol-flash';
import { tables } from '../../../../app/core/study/records';
import { consent, participant, protocol, stimulus } from './study-records';

/** The protocol-side flash rule (the participant-safety rules of the study set-up; common practice, no source). */
const steps = [
  { kind: 'calibrate' as const },
  { kind: 'clip' as const, stimulusId: 'forklift-crossing' },
  { kind: 'block' as const, name: 'aisle', stimulusIds: ['conveyor-parcels', 'warning-beacon', 'forklift-crossing'] },
];
const stimuli = [stimulus('forklift-crossing'), stimulus('conveyor-parcels'), stimulus('warning-beacon', true)];

describe('the clips of a protocol that may flash', () => {
  it('lists every clip once and finds the ones marked as failing the flash analysis', () => {
    expect(protocolClips(steps)).toEqual(['forklift-crossing', 'conveyor-parcels', 'warning-beacon']);
    expect(flashingClips(protocol({ steps }), stimuli)).toEqual(['warning-beacon']);
    expect(flashingClips(protocol({ steps }), [stimulus('warning-beacon')])).toEqual([]);
  });

  it('is recorded in the protocol when saved, and the record counts even if a mark is later missing', () => {
    const saved = withFlashRecord(protocol({ steps }), stimuli);
    expect(saved.flashingStimulusIds).toEqual(['warning-beacon']);
    expect(tables.protocols.parse(saved)).toEqual(saved);
    expect(flashingClips(saved, [stimulus('warning-beacon')])).toEqual(['warning-beacon']);
    // Removing the flashing clip removes the record.
    const without = withFlashRecord({ ...saved, steps: steps.slice(0, 2) }, stimuli);
    expect(without).not.toHaveProperty('flashingStimulusIds');
  });
});

describe('the session set-up refuses a protocol with flashing clips for a participant not cleared', () => {
  const saved = withFlashRecord(protocol({ steps, name: 'Aisle clips' }), stimuli);

  it('refuses, naming the protocol and the clip', () => {
    const problems = protocolFlashProblems(saved, participant({ photosensitivityCleared: false }), stimuli);
    expect(problems).toEqual(['The protocol "Aisle clips" shows clips that may flash ("warning beacon"), so it runs only participants cleared in photosensitivity screening.']);
  });

  it('allows a cleared participant, and any participant when no clip may flash', () => {
    expect(protocolFlashProblems(saved, participant({ photosensitivityCleared: true }), stimuli)).toEqual([]);
    expect(protocolFlashProblems(protocol({ steps }), participant({ photosensitivityCleared: false }), [stimulus('warning-beacon')])).toEqual([]);
  });

  it('refuses from the record alone, where the participant check of the plan sees no mark', () => {
    const unmarked = [stimulus('forklift-crossing'), stimulus('conveyor-parcels'), stimulus('warning-beacon')];
    const p = participant({ photosensitivityCleared: false });
    expect(checkEligibility(p, [consent()], unmarked).ok).toBe(true);
    expect(protocolFlashProblems(saved, p, unmarked)).toHaveLength(1);
  });
});
