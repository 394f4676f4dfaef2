import { describe, expect, it } from 'vitest';
import { protocolRecord } from '../../../../app/core/study/records';
import { defaultStep, draftProblems, latestVersions, moveStep, newProtocol, protocolLineage, recordToSave, versionId } from '../../../../renderer/console/protocols/protocol-draft';

const now = '2026-03-02T10:00:00.000Z';
const later = '2026-03-03T10:00:00.000Z';

describe('protocol drafts', () => {
  it('start as a valid protocol', () => {
    const p = newProtocol('study-1', 'protocol-a', now);
    expect(protocolRecord.safeParse(p).success).toBe(true);
    expect(draftProblems(p)).toEqual([]);
  });

  it('move one step at a time and ignore moves past either end', () => {
    expect(moveStep(['a', 'b', 'c', 'd'], 2, 1)).toEqual(['a', 'c', 'b', 'd']);
    expect(moveStep(['a', 'b', 'c', 'd'], 0, 3)).toEqual(['b', 'c', 'd', 'a']);
    expect(moveStep(['a', 'b'], 0, -1)).toEqual(['a', 'b']);
    expect(moveStep(['a', 'b'], 1, 2)).toEqual(['a', 'b']);
  });

  it('name the step that is wrong', () => {
    const p = { ...newProtocol('study-1', 'protocol-a', now), steps: [{ kind: 'calibrate' as const }, { kind: 'rest' as const, seconds: 0 }] };
    const problems = draftProblems(p);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/^Step 2 \(seconds\): /);
    expect(draftProblems({ ...p, steps: [] })[0]).toMatch(/^steps: /);
  });

  it('need a stimulus for a clip or block step', () => {
    expect(defaultStep('clip', null)).toBeNull();
    expect(defaultStep('block', 'aisle')).toEqual({ kind: 'block', name: 'Clips', stimulusIds: ['aisle'] });
    expect(defaultStep('drift_check', null)).toEqual({ kind: 'drift_check' });
  });

  it('are saved in place until a session used them, then as the next version', () => {
    const v1 = newProtocol('study-1', 'protocol-a', now);
    const edited = { ...v1, name: 'Aisle protocol' };
    expect(recordToSave(edited, 1, false, later)).toEqual({ ...edited, updatedAt: later });
    const v2 = recordToSave(edited, 1, true, later);
    expect(v2).toMatchObject({ id: 'protocol-a.v2', version: 2, name: 'Aisle protocol', createdAt: later });
    const v3 = recordToSave({ ...v2, name: 'Aisle protocol 3' }, 2, true, later);
    expect(v3.id).toBe('protocol-a.v3');
    expect(protocolLineage(v3.id)).toBe('protocol-a');
    expect(versionId('protocol-a', 1)).toBe('protocol-a');
    expect(latestVersions([v1, v3, v2]).map((p) => p.id)).toEqual(['protocol-a.v3']);
  });
});
