/**
 * Record changes between schema versions, as pure functions so that they are tested on
 * their own as well as through a real upgrade.
 */

interface ParticipantV1 {
  id: string;
  studyId: string;
  createdAt: string;
  enrolment?: number;
}

/**
 * Version 1 → 2: number each study's participants 1, 2, 3, ... in the order they were
 * registered (creation time, then id, so ties are broken the same way everywhere).
 */
export function numberEnrolments<T extends ParticipantV1>(participants: readonly T[]): (T & { enrolment: number })[] {
  const ordered = [...participants].sort((a, b) => a.studyId.localeCompare(b.studyId) || a.createdAt.localeCompare(b.createdAt) || a.id.localeCompare(b.id));
  const next = new Map<string, number>();
  return ordered.map((p) => {
    const enrolment = (next.get(p.studyId) ?? 0) + 1;
    next.set(p.studyId, enrolment);
    return { ...p, enrolment };
  });
}
