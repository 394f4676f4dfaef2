import { useState } from 'react';
import type { Failure } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { useLiveStatus } from './use-live-status';

const who = { console: 'the console', stage_key: 'the stage key' } as const;

/**
 * In the header while a recording runs (or the stage is blank): blanks the stage to
 * mid-grey and pauses everything at once; when blanked, says who blanked it and ends it.
 */
export function StageBlankButton() {
  const { api } = useHost();
  const status = useLiveStatus();
  const [failure, setFailure] = useState<Failure | null>(null);
  const blank = status?.blank ?? null;
  if (!status?.recording && !blank) return null;
  const act = async (call: () => ReturnType<typeof api.unblankStage>) => {
    const r = await call();
    setFailure(r.ok ? null : r);
  };
  return (
    <span className="stage-blank" role="group" aria-label="Stage blank">
      {blank ? (
        <>
          <span className="warning" role="status">
            Stage blanked by {who[blank.by]} ({blank.reason})
          </span>{' '}
          <button type="button" className="secondary" onClick={() => void act(() => api.unblankStage({}))}>
            Unblank stage
          </button>
        </>
      ) : (
        <button type="button" className="danger" aria-keyshortcuts="X" title="Blank the stage to mid-grey and pause everything (X in the session console, X or Esc on the stage)" onClick={() => void act(() => api.blankStage({ reason: 'console button' }))}>
          Blank stage
        </button>
      )}
      {failure && <FailureNote failure={failure} />}
    </span>
  );
}
