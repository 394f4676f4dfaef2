import { useState } from 'react';
import type { RecordOf } from '../../../app/core/study/records';

type Scope = RecordOf<'exclusions'>['scope'];

/** Why a form cannot be saved yet, or null when it can. */
export function exclusionProblem(kind: Scope['kind'], stimulusId: string, fromS: string, toS: string, reason: string): string | null {
  if (reason.trim() === '') return 'Give a reason.';
  if (kind === 'clip' && stimulusId === '') return 'Choose the clip.';
  if (kind === 'time_range') {
    const from = Number(fromS);
    const to = Number(toS);
    if (fromS.trim() === '' || toS.trim() === '' || !Number.isFinite(from) || !Number.isFinite(to)) return 'Give the time range in seconds from the first sample.';
    if (from < 0 || to <= from) return 'The range must start at 0 s or later and end after it starts.';
  }
  return null;
}

/** A new exclusion: the whole session, one clip or a time range, always with a reason. */
export function ExclusionForm({ clips, onSave }: { clips: readonly { stimulusId: string; name: string }[]; onSave: (scope: Scope, reason: string) => Promise<void> }) {
  const [kind, setKind] = useState<Scope['kind']>('session');
  const [stimulusId, setStimulusId] = useState('');
  const [fromS, setFromS] = useState('');
  const [toS, setToS] = useState('');
  const [reason, setReason] = useState('');
  const [tried, setTried] = useState(false);
  const problem = exclusionProblem(kind, stimulusId, fromS, toS, reason);
  const save = async () => {
    setTried(true);
    if (problem) return;
    const scope: Scope = kind === 'session' ? { kind } : kind === 'clip' ? { kind, stimulusId } : { kind, fromS: Number(fromS), toS: Number(toS) };
    await onSave(scope, reason.trim());
    setReason('');
    setTried(false);
  };
  return (
    <form
      className="exclusion-form"
      aria-label="New exclusion"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
    >
      <fieldset>
        <legend>Exclude</legend>
        {(['session', 'clip', 'time_range'] as const).map((k) => (
          <label key={k} className="check">
            <input type="radio" name="exclusion-scope" checked={kind === k} onChange={() => setKind(k)} /> {k === 'session' ? 'The whole session' : k === 'clip' ? 'One clip' : 'A time range'}
          </label>
        ))}
      </fieldset>
      {kind === 'clip' && (
        <label className="field">
          Clip
          <select value={stimulusId} onChange={(e) => setStimulusId(e.target.value)}>
            <option value="">(choose)</option>
            {clips.map((c) => (
              <option key={c.stimulusId} value={c.stimulusId}>
                {c.name}
              </option>
            ))}
          </select>
        </label>
      )}
      {kind === 'time_range' && (
        <div className="button-row">
          <label className="field">
            From (s) <input type="number" min={0} step="any" value={fromS} onChange={(e) => setFromS(e.target.value)} />
          </label>
          <label className="field">
            To (s) <input type="number" min={0} step="any" value={toS} onChange={(e) => setToS(e.target.value)} />
          </label>
        </div>
      )}
      <label className="field">
        Reason for the exclusion <textarea rows={2} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={2000} />
      </label>
      {tried && problem && (
        <p className="failure" role="alert">
          {problem}
        </p>
      )}
      <button type="submit">Add the exclusion</button>
    </form>
  );
}
