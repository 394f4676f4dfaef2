import { useEffect, useState } from 'react';
import type { Failure, LiveStatus, Result } from '../../../app/contract';
import type { LookName } from '../../../app/core/render';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { useStimuli } from '../stimuli/use-stimuli';

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
  const playback = status?.playback ?? null;

  useEffect(() => {
    if (!clip && stimuli && stimuli.length > 0) setClip(stimuli[0]!.id);
  }, [stimuli, clip]);

  const act = async (call: () => Promise<Result<unknown>>) => {
    const result = await call();
    setFailure(result.ok ? null : result);
  };
  const chosen = stimuli?.find((s) => s.id === clip);
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
            {[0.1, 0.25, 0.5, 0.75, 1].map((s) => (
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
        <button type="button" disabled={!clip} onClick={() => void act(() => api.playClip({ stimulusId: clip, speed: Number(speed), look, placement, photodiode }))}>
          Play on stage
        </button>
        <button type="button" className="secondary" disabled={!playback} onClick={() => void act(() => (playback?.state === 'paused' ? api.resumePlayback({}) : api.pausePlayback({})))}>
          {playback?.state === 'paused' ? 'Resume' : 'Pause'}
        </button>
        <button type="button" className="secondary" disabled={!playback} onClick={() => void act(() => api.stopPlayback({}))}>
          Stop clip
        </button>
      </div>
      <p className="muted" data-testid="playback-state">
        {playback ? `${playback.clip}: ${playback.state}${playback.stimulusUs !== null ? ` at ${(playback.stimulusUs / 1e6).toFixed(2)} s` : ''}` : 'No clip playing.'}
      </p>
      {failure && <FailureNote failure={failure} />}
    </section>
  );
}
