import { useLayoutEffect, useRef, useState, type KeyboardEvent } from 'react';
import type { ProtocolStep, RecordOf } from '../../../app/core/study/records';
import { defaultStep, moveStep } from './protocol-draft';
import { StepFields, stepKindLabels } from './StepFields';

type StimulusRecord = RecordOf<'stimuli'>;
const kinds = Object.keys(stepKindLabels) as ProtocolStep['kind'][];

/**
 * The protocol's ordered steps. Keyboard: focus a step (Tab), Alt+↑ / Alt+↓ move it, Delete
 * removes it (Undo brings it back).
 */
export function StepList({ steps, stimuli, onChange }: { steps: ProtocolStep[]; stimuli: readonly StimulusRecord[]; onChange: (steps: ProtocolStep[]) => void }) {
  const [kind, setKind] = useState<ProtocolStep['kind']>('clip');
  const [removed, setRemoved] = useState<{ step: ProtocolStep; at: number } | null>(null);
  const items = useRef<(HTMLLIElement | null)[]>([]);
  const firstStimulus = stimuli[0]?.id ?? null;

  // The moved step keeps the focus, before the next key press is handled.
  const focusNext = useRef<number | null>(null);
  useLayoutEffect(() => {
    if (focusNext.current === null) return;
    items.current[focusNext.current]?.focus();
    focusNext.current = null;
  });
  const move = (from: number, to: number) => {
    if (to < 0 || to >= steps.length) return;
    focusNext.current = to;
    onChange(moveStep(steps, from, to));
  };
  const remove = (at: number) => {
    setRemoved({ step: steps[at]!, at });
    onChange(steps.filter((_, i) => i !== at));
  };
  const onKey = (event: KeyboardEvent<HTMLLIElement>, i: number) => {
    if (event.target !== event.currentTarget) return; // keys typed into a step's own fields
    if (event.altKey && event.key === 'ArrowUp') move(i, i - 1);
    else if (event.altKey && event.key === 'ArrowDown') move(i, i + 1);
    else if (event.key === 'Delete') remove(i);
    else return;
    event.preventDefault();
  };
  const added = defaultStep(kind, firstStimulus);

  return (
    <section aria-labelledby="steps-heading">
      <h3 id="steps-heading">Steps</h3>
      <p className="muted">Focus a step and press Alt+↑ or Alt+↓ to move it, Delete to remove it.</p>
      <ol className="step-list" aria-label="Steps">
        {steps.map((step, i) => (
          <li key={`${i}-${step.kind}`} ref={(el) => void (items.current[i] = el)} tabIndex={0} aria-label={`Step ${i + 1}: ${stepKindLabels[step.kind]}`} onKeyDown={(e) => onKey(e, i)}>
            <strong>{stepKindLabels[step.kind]}</strong> <StepFields step={step} n={i + 1} stimuli={stimuli} onChange={(s) => onChange(steps.map((old, k) => (k === i ? s : old)))} />
            <span className="step-buttons">
              <button type="button" className="secondary" aria-label={`Move step ${i + 1} up`} disabled={i === 0} onClick={() => move(i, i - 1)}>
                ↑
              </button>
              <button type="button" className="secondary" aria-label={`Move step ${i + 1} down`} disabled={i === steps.length - 1} onClick={() => move(i, i + 1)}>
                ↓
              </button>
              <button type="button" className="secondary danger" aria-label={`Remove step ${i + 1}`} onClick={() => remove(i)}>
                ✕
              </button>
            </span>
          </li>
        ))}
      </ol>
      {removed && (
        <p className="undo-bar" role="status">
          Removed step {removed.at + 1} ({stepKindLabels[removed.step.kind]}).{' '}
          <button
            type="button"
            className="link"
            onClick={() => {
              onChange([...steps.slice(0, removed.at), removed.step, ...steps.slice(removed.at)]);
              setRemoved(null);
            }}
          >
            Undo
          </button>
        </p>
      )}
      <div className="inline-fields">
        <label>
          New step{' '}
          <select aria-label="New step kind" value={kind} onChange={(e) => setKind(e.target.value as ProtocolStep['kind'])}>
            {kinds.map((k) => (
              <option key={k} value={k}>
                {stepKindLabels[k]}
              </option>
            ))}
          </select>
        </label>{' '}
        <button type="button" disabled={!added} onClick={() => added && onChange([...steps, added])}>
          Add step
        </button>
        {!added && <span className="muted"> Add stimuli to the study first (Study screen).</span>}
      </div>
    </section>
  );
}
