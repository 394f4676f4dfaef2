import { useEffect, useState } from 'react';
import type { Failure } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost, useHostQuery } from '../host-context';
import { useStageStatus } from '../use-stage-status';

export function StagePanel() {
  const { api } = useHost();
  const displays = useHostQuery((host) => host.listDisplays({}));
  const [displayId, setDisplayId] = useState<string | null>(null);
  const status = useStageStatus();
  const [failure, setFailure] = useState<Failure | null>(null);

  useEffect(() => {
    if (displays?.ok && displayId === null) {
      const preferred = displays.value.displays.find((d) => !d.primary) ?? displays.value.displays[0];
      if (preferred) setDisplayId(preferred.id);
    }
  }, [displays, displayId]);

  const open = async (): Promise<void> => {
    const result = await api.openStage({ displayId });
    if (!result.ok) return setFailure(result);
    setFailure(null);
    if (result.value.how === 'url') {
      // Browser mode: the stage is its own visible window, never a background tab.
      window.open(result.value.url, 'gazeloom-stage', 'popup,width=1280,height=800');
    }
  };

  return (
    <section className="panel" aria-labelledby="stage-heading">
      <h2 id="stage-heading">Stage</h2>
      {displays?.ok && displays.value.canChoose && (
        <label className="field">
          Display
          <select value={displayId ?? ''} onChange={(event) => setDisplayId(event.target.value)}>
            {displays.value.displays.map((display) => (
              <option key={display.id} value={display.id}>
                {display.label} ({display.bounds.width}×{display.bounds.height}
                {display.refreshHz ? `, ${display.refreshHz} Hz` : ''}){display.primary ? ', primary' : ''}
              </option>
            ))}
          </select>
        </label>
      )}
      {displays?.ok && !displays.value.canChoose && (
        <p className="muted">Browser mode: the stage opens in its own window; move it to the participant's display and make it fullscreen (F11).</p>
      )}
      <button type="button" onClick={() => void open()}>
        Open stage
      </button>
      {failure && <FailureNote failure={failure} />}
      <p className="stage-status" data-testid="stage-status">
        {status === null || !status.connected
          ? 'Stage not connected.'
          : `Stage connected: ${status.width}×${status.height} px, drawing with ${status.renderer === 'webgl2' ? 'WebGL2' : 'Canvas 2D'}.`}
      </p>
      {status?.connected && !status.visible && (
        <p className="warning" role="alert">
          The stage window is hidden or in the background: the browser slows its drawing. Bring it to the front before running a session.
        </p>
      )}
    </section>
  );
}
