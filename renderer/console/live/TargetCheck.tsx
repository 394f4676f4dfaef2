import { useState } from 'react';
import type { Failure, LiveStatus } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { useStageStatus } from '../use-stage-status';

/**
 * A quick check of the set-up: show a target at the screen centre (or a corner) and see
 * whether the live gaze lands on it. Proper calibration and validation run in sessions.
 */
export function TargetCheck({ status }: { status: LiveStatus | null }) {
  const { api } = useHost();
  const [shown, setShown] = useState<string | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const stage = useStageStatus();
  // Positions are in the display's pixels while recording, else in the stage window's.
  const size = status?.display ? { width: status.display.widthPx, height: status.display.heightPx } : stage?.connected ? stage : null;
  const show = async (fx: number, fy: number) => {
    if (shown) await api.hideTarget({ targetId: shown });
    if (!size) return;
    const result = await api.showTarget({ x: size.width * fx, y: size.height * fy, purpose: 'validation' });
    if (result.ok) setShown(result.value.targetId);
    setFailure(result.ok ? null : result);
  };
  return (
    <section className="panel" aria-labelledby="target-heading">
      <h2 id="target-heading">Target check</h2>
      <div className="button-row">
        <button type="button" className="secondary" disabled={!size} onClick={() => void show(0.5, 0.5)}>
          Target at the centre
        </button>
        <button type="button" className="secondary" disabled={!size} onClick={() => void show(0.1, 0.1)}>
          Top left
        </button>
        <button type="button" className="secondary" disabled={!size} onClick={() => void show(0.9, 0.9)}>
          Bottom right
        </button>
        <button
          type="button"
          className="secondary"
          disabled={!shown}
          onClick={async () => {
            if (shown) await api.hideTarget({ targetId: shown });
            setShown(null);
          }}
        >
          Hide target
        </button>
      </div>
      {!size && <p className="muted">Open the stage (Overview) or start a recording to show targets.</p>}
      {failure && <FailureNote failure={failure} />}
    </section>
  );
}
