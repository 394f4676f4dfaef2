import { useEffect, useState } from 'react';
import type { Failure, LiveStatus, Result } from '../../../app/contract';
import type { LookName } from '../../../app/core/render';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { useStimuli } from '../stimuli/use-stimuli';
import { PLAYBACK_SPEEDS } from '../../../app/core/study/protocol-defaults';

/** Choose a clip and how it is shown, then play, pause, resume and stop it on the stage. */
export function PlaybackControls({ status }: { status: LiveStatus | null }) {
  const { api } = useHost();
  const { stimuli } = useStimuli();
  const [clip, setClip] = useState('');
  const [speed, setSpeed] = useState('1');
  const [look, setLook] = useState<LookName>('polarity');
  const [placement, setPlacement] = useState<'fit' | '1:1' | 'integer'>('fit');
  const [photodiode, setPhotodiode] = useState(false);
  const [failure, setFailure] = useState<Failure | null>(null);
  /** A clip that may flash plays only after its warning is answered. */
  const [confirmFlash, setConfirmFlash] = useState(false);
  const playback = status?.playback ?? null;

  useEffect(() => {
    if (!clip && stimuli && stimuli.length > 0) setClip(stimuli[0]!.id);
  }, [stimuli, clip]);

  const act = async (call: () => Promise<Result<unknown>>) => {
    const result = await call();
    setFailure(result.ok ? null : result);
  };
  const chosen = stimuli?.find((s) => s.id === clip);
  const play = () => act(() => api.playClip({ stimulusId: clip, speed: Number(speed), look, placement, photodiode }));
  return (
    <section className="panel" aria-labelledby="playback-heading">
      <h2 id="playback-heading">Clip on the stage</h2>
      <label className="field">
        Clip
        <select aria-label="Clip to play" value={clip} onChange={(e) => setClip(e.target.value)}>
          {stimuli?.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
              {s.mayFlash ? ' (may flash)' : ''}
            </option>
          ))}
        </select>
      </label>
      <div className="inline-fields">
        <label>
          Speed{' '}
          <select value={speed} onChange={(e) => setSpeed(e.target.value)}>
            {PLAYBACK_SPEEDS.map((s) => (
              <option key={s} value={s}>
                {s}×
              </option>
            ))}
          </select>
        </label>
        <label>
          Look{' '}
          <select value={look} onChange={(e) => setLook(e.target.value as LookName)}>
            <option value="polarity">polarity colours</option>
            <option value="decay">decay</option>
            <option value="grey">grey accumulation</option>
          </select>
        </label>
        <label>
          Placement{' '}
          <select value={placement} onChange={(e) => setPlacement(e.target.value as typeof placement)}>
            <option value="fit">fit (letterbox)</option>
            <option value="integer">integer scale</option>
            <option value="1:1">1:1 pixels</option>
          </select>
        </label>
        <label className="check">
          <input type="checkbox" checked={photodiode} onChange={(e) => setPhotodiode(e.target.checked)} /> Photodiode patch
        </label>
      </div>
      {chosen?.mayFlash && <p className="warning">This clip may flash: show it only to participants cleared for photosensitivity.</p>}
      <div className="button-row">
        <button type="button" disabled={!clip || confirmFlash} onClick={() => (chosen?.mayFlash ? setConfirmFlash(true) : void play())}>
          Play on stage
        </button>
        <button type="button" className="secondary" disabled={!playback} onClick={() => void act(() => (playback?.state === 'paused' ? api.resumePlayback({}) : api.pausePlayback({})))}>
          {playback?.state === 'paused' ? 'Resume' : 'Pause'}
        </button>
        <button type="button" className="secondary" disabled={!playback} onClick={() => void act(() => api.stopPlayback({}))}>
          Stop clip
        </button>
      </div>
      {confirmFlash && (
        <div role="alertdialog" aria-label="This clip may flash" className="confirm warning" onKeyDown={(e) => e.key === 'Escape' && setConfirmFlash(false)}>
          {chosen?.name ?? clip} may flash (it failed the flash screening). Show it only to a participant cleared in photosensitivity screening, and be ready to blank the stage.{' '}
          <button type="button" className="danger" onClick={() => (setConfirmFlash(false), void play())}>
            Play anyway
          </button>{' '}
          <button type="button" className="secondary" autoFocus onClick={() => setConfirmFlash(false)}>
            Do not play (Esc)
          </button>
        </div>
      )}
      <p className="muted" data-testid="playback-state">
        {playback ? `${playback.clip}: ${playback.state}${playback.stimulusUs !== null ? ` at ${(playback.stimulusUs / 1e6).toFixed(2)} s` : ''}` : 'No clip playing.'}
      </p>
      {failure && <FailureNote failure={failure} />}
    </section>
  );
}
