import { useEffect, useRef, useState } from 'react';
import { sealText, type DataKey } from '../../../app/core/crypto';
import type { RunnerState } from '../../../app/core/study/session-runner';
import type { SessionCommand } from './key-map';
import { CalibrationResiduals } from './CalibrationResiduals';
import { KeyMapHelp } from './KeyMapHelp';
import { RepeatPoints } from './RepeatPoints';
import { hostNow } from './step-actions';
import { StepActivity } from './StepActivity';
import { StepTable } from './StepTable';
import { TextDialog } from './TextDialog';
import { useSessionKeys } from './use-session-keys';
import { RestWarnings } from './RestWarnings';
import { useBlankPause } from './use-blank-pause';
import { useSessionRunner, type RunContext } from './use-session-runner';

type Dialog = 'note' | 'bad' | 'end' | null;

/** The running session: the current step, the controls (keys and buttons), notes and marks. */
export function SessionRun({ ctx, initial, dataKey, participantCode, clipName, onEnd }: { ctx: RunContext; initial: RunnerState; dataKey: DataKey | null; participantCode: string; clipName: (id: string) => string; onEnd: (state: RunnerState) => void }) {
  const { state, dispatch, activity, lastResult, failure, proceedNow, calibrationFit } = useSessionRunner(ctx, initial);
  const blank = useBlankPause(state.phase, dispatch);
  const [dialog, setDialog] = useState<Dialog>(null);
  const [help, setHelp] = useState(true);
  const [notes, setNotes] = useState(0);
  const region = useRef<HTMLElement>(null);
  const ended = useRef(false);
  const { session } = ctx;

  // Keys reach the console again when a dialog closes.
  useEffect(() => {
    if (dialog === null) region.current?.focus();
  }, [dialog]);
  useEffect(() => {
    if (state.phase === 'finished' && !ended.current) {
      ended.current = true;
      onEnd(state);
    }
  }, [state, onEnd]);

  // The step a bad mark applies to: the running one, else the last finished one.
  const running = state.phase === 'running' ? state.steps[state.cursor] : undefined;
  const lastFinished = [...state.steps.slice(0, state.cursor)].reverse().find((s) => s.state === 'done' || s.state === 'bad');
  const badTarget = running ?? lastFinished;

  const command = (c: SessionCommand) => {
    if (c === 'close') return setDialog(null);
    if (dialog) return;
    if (c === 'continue') proceedNow();
    else if (c === 'pause') (state.phase !== 'paused' || !blank) && dispatch({ type: state.phase === 'paused' ? 'resume' : 'pause' });
    else if (c === 'skip') dispatch({ type: 'skip' });
    else if (c === 'repeatValidation') dispatch({ type: 'repeatValidation' });
    else if (c === 'recalibrate') dispatch({ type: 'recalibrate' });
    else if (c === 'markBad') badTarget && setDialog('bad');
    else if (c === 'note') dataKey && setDialog('note');
    else if (c === 'end') setDialog('end');
    else if (c === 'blank') void ctx.api.blankStage({ reason: 'console key X' });
    else if (c === 'help') setHelp((h) => !h);
  };
  // While the console is locked (no data key) the keys belong to the lock screen.
  useSessionKeys(dialog === null && dataKey !== null, command);

  const saveNote = async (text: string) => {
    if (!dataKey) return;
    const [hostNs, sealed] = await Promise.all([hostNow(ctx.api), sealText(dataKey, text)]);
    const record = { id: `${session.id}-note-${globalThis.crypto.randomUUID()}`, sessionId: session.id, participantId: session.participantId, at: new Date().toISOString(), hostNs, operatorId: session.operatorId, text: sealed! };
    await ctx.store.put('notes', record, { operatorId: ctx.operatorId, action: 'add_note', summary: `note on session ${session.id}` });
    setNotes((n) => n + 1);
    setDialog(null);
  };
  const button = (label: string, key: string, c: SessionCommand, disabled = false, className = 'secondary') => (
    <button type="button" className={className} disabled={disabled} aria-keyshortcuts={key} onClick={() => command(c)}>
      {label} <kbd>{key}</kbd>
    </button>
  );
  const live = state.phase !== 'finished';

  return (
    <section className="session-run" aria-label={`Session ${participantCode}`} ref={region} tabIndex={-1}>
      <div className="panel">
        <h2>
          Session {participantCode} <span className="muted">{session.id}</span>
        </h2>
        <StepActivity state={state} activity={activity} clipName={clipName} />
        {state.phase === 'prompt' && state.prompt && (
          <div role="alertdialog" aria-label="Recalibration suggested" className="warning">
            <p>Recalibration suggested: {state.prompt.reason}</p>
            {button('Recalibrate', 'C', 'recalibrate', false, '')} {button('Repeat validation', 'V', 'repeatValidation')} {button('Continue without', 'Enter', 'continue')}
          </div>
        )}
        <div className="button-row" aria-label="Session controls" role="toolbar">
          {state.phase === 'ready' && button('Begin', 'Enter', 'continue', false, '')}
          {activity?.kind === 'message' && button('Continue', 'Enter', 'continue', false, '')}
          {activity?.kind === 'flashWarning' && button('Play the clip', 'Enter', 'continue', false, '')}
          {button(state.phase === 'paused' ? 'Resume' : 'Pause', 'Space', 'pause', (state.phase !== 'running' && state.phase !== 'paused') || (state.phase === 'paused' && blank !== null))}
          {button('Blank stage', 'X', 'blank', blank !== null, 'danger')}
          {button('Skip step', 'N', 'skip', !live || state.phase === 'prompt')}
          {button('Repeat validation', 'V', 'repeatValidation', !live)}
          {button('Recalibrate', 'C', 'recalibrate', !live)}
          {button('Mark trial bad', 'B', 'markBad', !badTarget)}
          {button('Note', 'T', 'note', !dataKey)}
          {button('End session', 'E', 'end', false, 'danger')}
        </div>
        {blank && (
          <p className="warning" role="alert">
            The stage is blanked: the session is paused. End the blank with Unblank stage in the header, then resume.
          </p>
        )}
        {live && <RestWarnings rest={state.rest} />}
        {lastResult && <p data-testid="last-result">{lastResult}</p>}
        {calibrationFit && <CalibrationResiduals fit={calibrationFit} />}
        {live && <RepeatPoints ctx={ctx} busy={activity?.kind === 'targets'} />}
        {notes > 0 && <p className="muted">{notes} note{notes === 1 ? '' : 's'} saved in this session.</p>}
        {failure && (
          <p className="failure" role="alert">
            {failure}
          </p>
        )}
        {dialog === 'end' && (
          <div role="alertdialog" aria-label="End the session" className="confirm" onKeyDown={(e) => e.key === 'Escape' && setDialog(null)}>
            End the session now? Steps not run stay unfinished.{' '}
            <button type="button" className="danger" onClick={() => onEnd(state)}>
              End session
            </button>{' '}
            <button type="button" className="secondary" autoFocus onClick={() => setDialog(null)}>
              Keep going (Esc)
            </button>
          </div>
        )}
      </div>
      <StepTable state={state} clipName={clipName} />
      {help && <KeyMapHelp />}
      {dialog === 'note' && <TextDialog title="Note" label="Note (timestamped, stored encrypted)" saveLabel="Save note" onSave={saveNote} onClose={() => setDialog(null)} />}
      {dialog === 'bad' && badTarget && (
        <TextDialog
          title={`Mark step ${state.steps.indexOf(badTarget) + 1} bad`}
          label="Reason"
          saveLabel="Mark bad"
          onSave={(reason) => {
            dispatch({ type: 'markBad', index: badTarget.index, reason });
            setDialog(null);
          }}
          onClose={() => setDialog(null)}
        />
      )}
    </section>
  );
}
