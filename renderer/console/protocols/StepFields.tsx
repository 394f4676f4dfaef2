import type { ProtocolStep, RecordOf } from '../../../app/core/study/records';

type StimulusRecord = RecordOf<'stimuli'>;

export const stepKindLabels: Record<ProtocolStep['kind'], string> = {
  calibrate: 'Calibrate',
  validate: 'Validate',
  drift_check: 'Drift check',
  clip: 'Clip',
  block: 'Block of clips',
  rest: 'Rest',
  message: 'Message screen',
};

const stimulusLabel = (s: StimulusRecord): string => `${s.name || s.id}${s.mayFlash ? ' (may flash)' : ''}`;

/** The fields of one step, by kind; `n` is the step's number for accessible names. */
export function StepFields({ step, n, stimuli, onChange }: { step: ProtocolStep; n: number; stimuli: readonly StimulusRecord[]; onChange: (step: ProtocolStep) => void }) {
  switch (step.kind) {
    case 'clip':
      return (
        <select aria-label={`Step ${n} clip`} value={step.stimulusId} onChange={(e) => onChange({ ...step, stimulusId: e.target.value })}>
          {stimuli.map((s) => (
            <option key={s.id} value={s.id}>
              {stimulusLabel(s)}
            </option>
          ))}
        </select>
      );
    case 'block':
      return (
        <span className="step-block">
          <input aria-label={`Step ${n} block name`} value={step.name} onChange={(e) => onChange({ ...step, name: e.target.value })} size={12} />
          <span role="group" aria-label={`Step ${n} clips in the block`}>
            {stimuli.map((s) => (
              <label key={s.id} className="check">
                <input
                  type="checkbox"
                  checked={step.stimulusIds.includes(s.id)}
                  onChange={(e) => onChange({ ...step, stimulusIds: e.target.checked ? [...step.stimulusIds, s.id] : step.stimulusIds.filter((id) => id !== s.id) })}
                />{' '}
                {stimulusLabel(s)}
              </label>
            ))}
          </span>
        </span>
      );
    case 'rest':
      return (
        <label>
          for{' '}
          <input aria-label={`Step ${n} rest seconds`} type="number" min={1} max={3600} value={step.seconds} onChange={(e) => onChange({ ...step, seconds: Number(e.target.value) })} size={5} /> s
        </label>
      );
    case 'message':
      return <input aria-label={`Step ${n} message text`} value={step.text} onChange={(e) => onChange({ ...step, text: e.target.value })} size={40} />;
    default:
      return null;
  }
}
