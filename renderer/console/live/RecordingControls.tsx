import { useState } from 'react';
import type { Failure, GazeSourceChoice, LiveStatus } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';

type SourceKind = GazeSourceChoice['kind'];

/** Display geometry and gaze source, then start and stop a recording. */
export function RecordingControls({ status }: { status: LiveStatus | null }) {
  const { api } = useHost();
  const [kind, setKind] = useState<SourceKind>('simulated');
  const [url, setUrl] = useState('udp://127.0.0.1:4242');
  const [seed, setSeed] = useState('1');
  const [rate, setRate] = useState('500');
  const [screen, setScreen] = useState({ widthMm: '530', heightMm: '298', widthPx: '1920', heightPx: '1080', distanceMm: '600' });
  const [failure, setFailure] = useState<Failure | null>(null);
  const [confirmStop, setConfirmStop] = useState(false);
  const recording = status?.recording ?? null;

  const start = async () => {
    const source: GazeSourceChoice = kind === 'feed' ? { kind, url } : kind === 'mouse' ? { kind } : { kind, seed: Number(seed), rateHz: Number(rate) };
    const display = Object.fromEntries(Object.entries(screen).map(([k, v]) => [k, Number(v)])) as { widthMm: number; heightMm: number; widthPx: number; heightPx: number; distanceMm: number };
    const result = await api.startRecording({ source, display });
    setFailure(result.ok ? null : result);
  };
  const stop = async () => {
    setConfirmStop(false);
    const result = await api.stopRecording({});
    setFailure(result.ok ? null : result);
  };

  const field = (key: keyof typeof screen, label: string) => (
    <label>
      {label} <input aria-label={label} value={screen[key]} onChange={(e) => setScreen({ ...screen, [key]: e.target.value })} size={5} disabled={recording !== null} />
    </label>
  );

  return (
    <section className="panel" aria-labelledby="recording-heading">
      <h2 id="recording-heading">Recording</h2>
      <fieldset disabled={recording !== null}>
        <legend>Display</legend>
        {field('widthMm', 'Width (mm)')} {field('heightMm', 'Height (mm)')} {field('widthPx', 'Width (px)')} {field('heightPx', 'Height (px)')} {field('distanceMm', 'Viewing distance (mm)')}
      </fieldset>
      <fieldset disabled={recording !== null}>
        <legend>Gaze source</legend>
        <label className="check">
          <input type="radio" name="source" checked={kind === 'simulated'} onChange={() => setKind('simulated')} /> Simulated tracker (demo and tests), seed{' '}
          <input aria-label="Simulated tracker seed" value={seed} onChange={(e) => setSeed(e.target.value)} size={4} /> at{' '}
          <input aria-label="Simulated tracker rate (Hz)" value={rate} onChange={(e) => setRate(e.target.value)} size={5} /> Hz
        </label>
        <label className="check">
          <input type="radio" name="source" checked={kind === 'feed'} onChange={() => setKind('feed')} /> Gaze feed from a tracker bridge, listening on{' '}
          <input aria-label="Gaze feed address" value={url} onChange={(e) => setUrl(e.target.value)} size={24} />
        </label>
        <label className="check">
          <input type="radio" name="source" checked={kind === 'mouse'} onChange={() => setKind('mouse')} /> Mouse on the stage (piloting without a tracker)
        </label>
      </fieldset>
      {recording === null ? (
        <button type="button" onClick={() => void start()}>
          Start recording
        </button>
      ) : confirmStop ? (
        <span role="alertdialog" aria-label="Confirm stop">
          Stop and close this recording?{' '}
          <button type="button" className="danger" onClick={() => void stop()}>
            Stop recording
          </button>{' '}
          <button type="button" className="secondary" onClick={() => setConfirmStop(false)}>
            Keep recording
          </button>
        </span>
      ) : (
        <button type="button" className="danger" onClick={() => setConfirmStop(true)}>
          Stop recording…
        </button>
      )}
      {failure && <FailureNote failure={failure} />}
    </section>
  );
}
