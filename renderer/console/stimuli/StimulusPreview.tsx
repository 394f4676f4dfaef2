import { useEffect, useRef, useState } from 'react';
import type { StimulusMeta } from '../../../app/contract';
import type { LookName } from '../../../app/core/render';
import { useHost } from '../host-context';
import { PreviewPlayer } from './preview-player';

interface Props {
  readonly stimulus: StimulusMeta;
  readonly timeUs: number;
  readonly onTime: (tUs: number) => void;
}

const looks: ReadonlyArray<{ id: LookName; label: string }> = [
  { id: 'polarity', label: 'Polarity colours' },
  { id: 'decay', label: 'Decay (time surface)' },
  { id: 'grey', label: 'Grey accumulation' },
];

/** Play, pause and scrub a stimulus as the stage would show it. Space plays and pauses; arrows step 10 ms. */
export function StimulusPreview({ stimulus, timeUs, onTime }: Props) {
  const { api } = useHost();
  const canvas = useRef<HTMLCanvasElement>(null);
  const player = useRef<PreviewPlayer | null>(null);
  const [playing, setPlaying] = useState(false);
  const [shownUs, setShownUs] = useState(timeUs);

  useEffect(() => {
    const p = new PreviewPlayer(api, stimulus, canvas.current!, (t, isPlaying) => {
      setShownUs(t);
      setPlaying(isPlaying);
      if (!isPlaying) onTime(t);
    });
    player.current = p;
    void p.showAt(timeUs);
    return () => p.dispose();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [api, stimulus.id]);

  useEffect(() => {
    const p = player.current;
    if (p && !p.isPlaying && Math.abs(p.timeUs - timeUs) > 1) void p.showAt(timeUs);
  }, [timeUs]);

  const seconds = (t: number) => ((t - stimulus.tStartUs) / 1e6).toFixed(3);
  const toggle = () => (player.current?.isPlaying ? player.current.pause() : player.current?.play());
  return (
    <div
      className="preview"
      tabIndex={0}
      aria-label="Preview"
      onKeyDown={(event) => {
        if (event.key === ' ') {
          event.preventDefault();
          toggle();
        } else if (event.key === 'ArrowRight' || event.key === 'ArrowLeft') {
          event.preventDefault();
          void player.current?.showAt(shownUs + (event.key === 'ArrowRight' ? 10_000 : -10_000));
        }
      }}
    >
      <canvas ref={canvas} className="preview-canvas" data-testid="preview-canvas" aria-label={`Preview of ${stimulus.name}`} />
      <div className="preview-controls">
        <button type="button" onClick={toggle} aria-label={playing ? 'Pause' : 'Play'}>
          {playing ? 'Pause' : 'Play'}
        </button>
        <input
          type="range"
          aria-label="Stimulus time (ms from the first event)"
          min={0}
          max={Math.ceil((stimulus.tEndUs - stimulus.tStartUs) / 1000)}
          step={1}
          value={Math.round((shownUs - stimulus.tStartUs) / 1000)}
          onChange={(e) => void player.current?.showAt(stimulus.tStartUs + Number(e.target.value) * 1000)}
        />
        <output aria-label="Time shown">{seconds(shownUs)} s</output>
        <label>
          Look{' '}
          <select onChange={(e) => player.current?.setLook(e.target.value as LookName)} defaultValue="polarity">
            {looks.map((l) => (
              <option key={l.id} value={l.id}>
                {l.label}
              </option>
            ))}
          </select>
        </label>
        <label>
          Speed{' '}
          <select onChange={(e) => player.current?.setSpeed(Number(e.target.value))} defaultValue="1">
            {[0.1, 0.25, 0.5, 1].map((s) => (
              <option key={s} value={s}>
                {s}×
              </option>
            ))}
          </select>
        </label>
      </div>
    </div>
  );
}
