import type { StudyRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';

/** The studies; choosing one makes it the study that the Participants, Protocols and Session screens work on. */
export function StudyList({ studies }: { studies: readonly StudyRecord[] }) {
  const { studyId, setStudyId } = useLab();
  return (
    <ul className="study-list" aria-label="Studies">
      {[...studies]
        .sort((a, b) => a.createdAt.localeCompare(b.createdAt))
        .map((s) => (
          <li key={s.id}>
            <button type="button" className={s.id === studyId ? '' : 'secondary'} aria-pressed={s.id === studyId} onClick={() => setStudyId(s.id)}>
              {s.name}
            </button>
            {s.demo && <span className="badge badge-warn">demo data</span>}
            {s.description && <span className="muted"> {s.description}</span>}
          </li>
        ))}
    </ul>
  );
}
