import { protocolRecord, type ProtocolRecord, type ProtocolStep } from '../../../app/core/study/records';
import { DEFAULT_THRESHOLDS } from '../../../app/core/study/protocol-defaults';

/**
 * Protocol versions: a protocol's first record has the id of its lineage; each new version
 * is a new record with the id LINEAGE.vN, so a session always finds the exact steps it was
 * run with (sessions store protocolId and protocolVersion).
 */
export const protocolLineage = (id: string): string => id.replace(/\.v\d+$/, '');
export const versionId = (lineage: string, version: number): string => (version === 1 ? lineage : `${lineage}.v${version}`);

/** The newest version of each protocol, by name. */
export function latestVersions(protocols: readonly ProtocolRecord[]): ProtocolRecord[] {
  const newest = new Map<string, ProtocolRecord>();
  for (const p of protocols) {
    const lineage = protocolLineage(p.id);
    const seen = newest.get(lineage);
    if (!seen || p.version > seen.version) newest.set(lineage, p);
  }
  return [...newest.values()].sort((a, b) => a.name.localeCompare(b.name));
}

/** A new protocol with the thresholds of common practice (validation mean 1.0°, worst point 1.5°, drift 1.5°). */
export function newProtocol(studyId: string, id: string, now: string): ProtocolRecord {
  return {
    id,
    studyId,
    name: 'New protocol',
    version: 1,
    steps: [{ kind: 'calibrate' }, { kind: 'validate' }, { kind: 'message', text: 'Thank you. The session is over.' }],
    counterbalancing: { kind: 'latin-square' },
    driftCheckEvery: 2,
    validationLayout: 5,
    thresholds: { ...DEFAULT_THRESHOLDS },
    look: 'polarity',
    speed: 1,
    createdAt: now,
    updatedAt: now,
  };
}

/** A step of a kind with sensible first values (a clip or block starts with the study's first stimulus). */
export function defaultStep(kind: ProtocolStep['kind'], firstStimulusId: string | null): ProtocolStep | null {
  switch (kind) {
    case 'clip':
      return firstStimulusId ? { kind, stimulusId: firstStimulusId } : null;
    case 'block':
      return firstStimulusId ? { kind, name: 'Clips', stimulusIds: [firstStimulusId] } : null;
    case 'rest':
      return { kind, seconds: 30 };
    case 'message':
      return { kind, text: 'Please keep looking at the screen.' };
    default:
      return { kind };
  }
}

/** Moves one step; out-of-range moves leave the list as it is. */
export function moveStep<T>(steps: readonly T[], from: number, to: number): T[] {
  if (from < 0 || from >= steps.length || to < 0 || to >= steps.length || from === to) return [...steps];
  const next = [...steps];
  const [moved] = next.splice(from, 1);
  next.splice(to, 0, moved!);
  return next;
}

const place = (path: readonly PropertyKey[]): string => {
  const [head, index, ...rest] = path;
  if (head === 'steps' && typeof index === 'number') return `Step ${index + 1}${rest.length ? ` (${rest.join('.')})` : ''}`;
  return path.join('.') || 'protocol';
};

/** What is wrong with a draft, one sentence per problem naming the step or field; empty when it can be saved. */
export function draftProblems(draft: ProtocolRecord): string[] {
  const parsed = protocolRecord.safeParse(draft);
  return parsed.success ? [] : parsed.error.issues.map((issue) => `${place(issue.path)}: ${issue.message}`);
}

/**
 * The record to store for an edited protocol. An edit of a protocol that a session has used
 * becomes the next version (a new record); otherwise the record is updated in place.
 */
export function recordToSave(draft: ProtocolRecord, newestVersion: number, usedBySession: boolean, now: string): ProtocolRecord {
  if (!usedBySession) return { ...draft, updatedAt: now };
  const version = newestVersion + 1;
  return { ...draft, id: versionId(protocolLineage(draft.id), version), version, createdAt: now, updatedAt: now };
}
