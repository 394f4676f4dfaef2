import type { RunnerState } from '../../../app/core/study/session-runner';

const kindLabels = { calibrate: 'Calibrate', validate: 'Validate', drift_check: 'Drift check', clip: 'Clip', rest: 'Rest', message: 'Message' } as const;

/** Every step of the session with its state; the current one is marked. */
export function StepTable({ state, clipName }: { state: RunnerState; clipName: (id: string) => string }) {
  return (
    <table className="step-table" aria-label="Session steps">
      <thead>
        <tr>
          <th>#</th>
          <th>Step</th>
          <th>State</th>
          <th>Note</th>
        </tr>
      </thead>
      <tbody>
        {state.steps.map((s, i) => (
          <tr key={s.index} aria-current={i === state.cursor && state.phase !== 'finished' ? 'step' : undefined}>
            <td>{i + 1}</td>
            <td>
              {kindLabels[s.kind]}
              {s.stimulusId ? `: ${clipName(s.stimulusId)}` : s.kind === 'rest' ? ` ${s.seconds} s` : ''}
            </td>
            <td>{s.state}</td>
            <td>{s.badReason ?? (s.attempts > 1 ? `${s.attempts} attempts` : '')}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
