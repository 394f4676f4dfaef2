import { useEffect, useState, type ReactNode } from 'react';
import type { RunnerState } from '../../../app/core/study/session-runner';
import type { Activity } from './use-session-runner';

function Countdown({ endsAtMs }: { endsAtMs: number }) {
  const [now, setNow] = useState(Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 250);
    return () => clearInterval(timer);
  }, []);
  return <>{Math.max(0, Math.ceil((endsAtMs - now) / 1000))} s left</>;
}

/** What the session is doing now, in one panel the operator can read at a glance. */
export function StepActivity({ state, activity, clipName }: { state: RunnerState; activity: Activity; clipName: (id: string) => string }) {
  const step = state.steps[state.cursor];
  const position = step ? `Step ${state.cursor + 1} of ${state.steps.length}` : 'All steps done';
  let text: ReactNode;
  if (state.phase === 'ready') text = 'Ready: press Enter (or Begin) to start.';
  else if (state.phase === 'paused') text = 'Paused: press Space (or Resume) to start this step again.';
  else if (state.phase === 'prompt') text = 'Waiting for the operator: recalibrate, repeat the validation or continue.';
  else if (state.phase === 'finished') text = 'Finished.';
  else if (activity?.kind === 'targets') text = `${activity.label}: targets on the stage…`;
  else if (activity?.kind === 'flashWarning')
    text = (
      <span role="alert" className="warning">
        Warning: the next clip, {clipName(activity.stimulusId)}, may flash (it failed the flash screening). Check that the participant is ready, then press Enter (or Play the clip) to show it, or N to skip it.
      </span>
    );
  else if (activity?.kind === 'clip') text = `Playing ${clipName(activity.stimulusId)} on the stage…`;
  else if (activity?.kind === 'rest') text = <>Rest: <Countdown endsAtMs={activity.endsAtMs} /></>;
  else if (activity?.kind === 'message') text = <>Message for the participant: “{activity.text}” Press Enter to go on.</>;
  else text = 'Starting…';
  return (
    <p className="step-activity" role="status" aria-live="polite" data-testid="session-activity">
      <strong>{position}.</strong> {text}
    </p>
  );
}
