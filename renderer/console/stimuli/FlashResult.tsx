import type { StimulusMeta } from '../../../app/contract';
import { FlashRegions } from './FlashRegions';
import { FlashTimeline } from './FlashTimeline';

interface Props {
  readonly stimulus: StimulusMeta;
  readonly cursorS: number;
  readonly onPick: (seconds: number) => void;
}

const degrees = (a: number, b: number) => `${a.toFixed(1)}° to ${b.toFixed(1)}°`;

/**
 * The clip's flash screening (WCAG 2.2 SC 2.3.1 thresholds) per look, on the clip's timeline,
 * with the failing screen regions. It supports, and never replaces, the lab's own screening
 * of participants and its review board.
 */
export function FlashResult({ stimulus, cursorS, onPick }: Props) {
  const screening = stimulus.flash;
  if (!screening) {
    return (
      <section className="flash-result" aria-labelledby="flash-heading">
        <h3 id="flash-heading">Flash screening</h3>
        <p className="warning">Not screened yet: until it is, the clip counts as one that may flash.</p>
      </section>
    );
  }
  const { display, rateHz, placement, speed } = screening.analysedWith;
  const failures = screening.looks.flatMap((l) => l.failures.map((f) => ({ ...f, look: l.look })));
  return (
    <section className="flash-result" aria-labelledby="flash-heading">
      <h3 id="flash-heading">Flash screening</h3>
      <p role="status" className={screening.pass ? undefined : 'warning'}>
        {screening.pass
          ? 'Passes: no flashing above the general or red flash thresholds in any look.'
          : `Fails in the ${screening.looks.filter((l) => !l.pass).map((l) => l.look).join(', ')} look: show it only to participants cleared for photosensitivity.`}
      </p>
      <p className="muted">
        As shown on a {display.widthMm}×{display.heightMm} mm, {display.widthPx}×{display.heightPx} px screen seen from {display.distanceMm} mm at {rateHz} Hz, placement{' '}
        {placement}, speed {speed}×. A screening aid; the lab&apos;s own participant screening and review board decide.
      </p>
      {screening.looks.map((result) => (
        <FlashTimeline key={result.look} result={result} durationS={stimulus.durationS} cursorS={cursorS} onPick={onPick} />
      ))}
      {failures.length > 0 && (
        <div className="detail-columns">
          <FlashRegions screening={screening} />
          <table aria-label="Flash failures">
            <thead>
              <tr>
                <th scope="col">Look</th>
                <th scope="col">Kind</th>
                <th scope="col">Time</th>
                <th scope="col">Flashes/s</th>
                <th scope="col">Region</th>
              </tr>
            </thead>
            <tbody>
              {failures.map((f, i) => (
                <tr key={i}>
                  <td>{f.look}</td>
                  <td>{f.kind}</td>
                  <td>
                    <button type="button" className="link" onClick={() => onPick(f.start_s)}>
                      {f.start_s.toFixed(2)}–{f.end_s.toFixed(2)} s
                    </button>
                  </td>
                  <td>{f.flashes_per_s}</td>
                  <td>
                    {f.region.width_px}×{f.region.height_px} px at ({f.region.x_px}, {f.region.y_px}); {degrees(f.region.left_deg, f.region.right_deg)} across,{' '}
                    {degrees(f.region.top_deg, f.region.bottom_deg)} down; {f.region.solid_angle_sr} sr
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
