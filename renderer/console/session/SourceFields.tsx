import type { GazeSourceChoice } from '../../../app/contract';
import type { DisplayGeometry } from '../../../app/core/geometry/display-geometry';

export interface SourceSetup {
  readonly kind: GazeSourceChoice['kind'];
  readonly url: string;
  readonly seed: string;
  readonly rateHz: string;
  readonly display: Record<keyof DisplayGeometry, string>;
}

export const defaultSourceSetup: SourceSetup = {
  kind: 'simulated',
  url: 'udp://127.0.0.1:4242',
  seed: '1',
  rateHz: '500',
  display: { widthMm: '530', heightMm: '298', widthPx: '1920', heightPx: '1080', distanceMm: '600' },
};

export function sourceChoice(s: SourceSetup): GazeSourceChoice {
  if (s.kind === 'feed') return { kind: 'feed', url: s.url };
  if (s.kind === 'mouse') return { kind: 'mouse' };
  return { kind: 'simulated', seed: Math.round(Number(s.seed)), rateHz: Number(s.rateHz) };
}

export const displayOf = (s: SourceSetup): DisplayGeometry => Object.fromEntries(Object.entries(s.display).map(([k, v]) => [k, Number(v)])) as unknown as DisplayGeometry;

/** The gaze source and the display geometry of a session. */
export function SourceFields({ value, onChange }: { value: SourceSetup; onChange: (value: SourceSetup) => void }) {
  const field = (key: keyof DisplayGeometry, label: string) => (
    <label>
      {label} <input aria-label={label} value={value.display[key]} onChange={(e) => onChange({ ...value, display: { ...value.display, [key]: e.target.value } })} size={5} />
    </label>
  );
  return (
    <>
      <fieldset>
        <legend>Display</legend>
        {field('widthMm', 'Width (mm)')} {field('heightMm', 'Height (mm)')} {field('widthPx', 'Width (px)')} {field('heightPx', 'Height (px)')} {field('distanceMm', 'Viewing distance (mm)')}
      </fieldset>
      <fieldset>
        <legend>Gaze source</legend>
        <label className="check">
          <input type="radio" name="session-source" checked={value.kind === 'simulated'} onChange={() => onChange({ ...value, kind: 'simulated' })} /> Simulated tracker, seed{' '}
          <input aria-label="Simulated tracker seed" value={value.seed} onChange={(e) => onChange({ ...value, seed: e.target.value })} size={4} /> at{' '}
          <input aria-label="Simulated tracker rate (Hz)" value={value.rateHz} onChange={(e) => onChange({ ...value, rateHz: e.target.value })} size={5} /> Hz
        </label>
        <label className="check">
          <input type="radio" name="session-source" checked={value.kind === 'feed'} onChange={() => onChange({ ...value, kind: 'feed' })} /> Gaze feed from a tracker bridge on{' '}
          <input aria-label="Gaze feed address" value={value.url} onChange={(e) => onChange({ ...value, url: e.target.value })} size={24} />
        </label>
        <label className="check">
          <input type="radio" name="session-source" checked={value.kind === 'mouse'} onChange={() => onChange({ ...value, kind: 'mouse' })} /> Mouse on the stage (piloting)
        </label>
      </fieldset>
    </>
  );
}
