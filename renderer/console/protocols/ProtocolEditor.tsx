import { useState } from 'react';
import type { ProtocolRecord, RecordOf } from '../../../app/core/study/records';
import { draftProblems } from './protocol-draft';
import { ProtocolSettings } from './ProtocolSettings';
import { RestLimitFields } from './RestLimitFields';
import { flashingClips, withFlashRecord } from '../../../app/core/study/protocol-flash';
import { StepList } from './StepList';

type StimulusRecord = RecordOf<'stimuli'>;

/** Edit one protocol: its settings and its ordered steps; saving is refused while anything is wrong. */
export function ProtocolEditor({
  initial,
  stimuli,
  usedBySession,
  onSave,
  onCancel,
}: {
  initial: ProtocolRecord;
  stimuli: readonly StimulusRecord[];
  usedBySession: boolean;
  onSave: (draft: ProtocolRecord) => Promise<void>;
  onCancel: () => void;
}) {
  const [draft, setDraft] = useState(initial);
  const [saving, setSaving] = useState(false);
  const problems = draftProblems(draft);
  const known = new Set(stimuli.map((s) => s.id));
  const missing = draft.steps.flatMap((s, i) => {
    const ids = s.kind === 'clip' ? [s.stimulusId] : s.kind === 'block' ? s.stimulusIds : [];
    return ids.filter((id) => !known.has(id)).map((id) => `Step ${i + 1}: the stimulus "${id}" is not in this study.`);
  });
  const all = [...problems, ...missing];
  // Judged on the library's marks now, not on what an earlier save recorded.
  const flashing = flashingClips({ steps: draft.steps }, stimuli).map((id) => stimuli.find((s) => s.id === id)?.name || id);
  return (
    <form
      className="panel protocol-editor"
      aria-label={`Edit protocol ${initial.name}`}
      onSubmit={async (event) => {
        event.preventDefault();
        if (all.length > 0) return;
        setSaving(true);
        try {
          await onSave(withFlashRecord(draft, stimuli));
        } finally {
          setSaving(false);
        }
      }}
    >
      <h2>
        {initial.name} <span className="muted">version {initial.version}</span>
      </h2>
      {usedBySession && <p className="warning">A session has used this version, so saving makes version {initial.version + 1}; the sessions keep the steps they were run with.</p>}
      <ProtocolSettings draft={draft} onChange={setDraft} />
      <RestLimitFields draft={draft} onChange={setDraft} />
      <StepList steps={draft.steps} stimuli={stimuli} onChange={(steps) => setDraft({ ...draft, steps })} />
      {flashing.length > 0 && (
        <p className="warning" role="alert" aria-label="Clips that may flash">
          {flashing.map((n) => `"${n}"`).join(', ')} may flash (failed the flash screening). The protocol records this when saved and runs only participants cleared in photosensitivity screening; a warning comes before each such clip plays.
        </p>
      )}
      {all.length > 0 && (
        <ul className="failure" aria-label="Problems">
          {all.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      <div className="button-row">
        <button type="submit" disabled={saving || all.length > 0}>
          {usedBySession ? 'Save as a new version' : 'Save protocol'}
        </button>
        <button type="button" className="secondary" onClick={onCancel}>
          Close without saving
        </button>
      </div>
    </form>
  );
}
