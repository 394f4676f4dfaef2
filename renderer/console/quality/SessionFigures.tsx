import type { SessionQuality } from '../../../app/core/quality/session-quality';
import { flagLabel, formatDeg, formatPct, formatRate } from './quality-format';

const time = (s: number | null) => (s === null ? 'n/a' : `${s.toFixed(1)} s`);

/** The session's figures as `gazeloom quality` prints them: each validation, each drift check, the drift rate and the flags. */
export function SessionFigures({ quality }: { quality: SessionQuality }) {
  return (
    <div className="panel">
      <dl className="facts" aria-label="Session quality">
        <dt>Flags</dt>
        <dd data-testid="session-flags">{quality.flags.length ? quality.flags.map(flagLabel).join(', ') : 'none'}</dd>
        <dt>Drift rate</dt>
        <dd data-testid="drift-rate">{formatRate(quality.drift_rate_deg_per_min)}</dd>
        <dt>Data loss (whole recording)</dt>
        <dd>{formatPct(quality.data_loss_pct)}</dd>
        <dt>Late frames</dt>
        <dd>{formatPct(quality.late_frames_pct)}</dd>
      </dl>
      <table className="quality-table" aria-label="Validations of the session">
        <thead>
          <tr>
            <th scope="col">Time</th>
            <th scope="col">Mean accuracy</th>
            <th scope="col">Worst point</th>
            <th scope="col">Precision RMS-S2S</th>
            <th scope="col">Precision SD</th>
            <th scope="col">Data loss</th>
            <th scope="col">Result</th>
          </tr>
        </thead>
        <tbody>
          {quality.validations.map((v, i) => (
            <tr key={i}>
              <td>{time(v.time_s)}</td>
              <td>{formatDeg(v.mean_accuracy_deg)}</td>
              <td>{formatDeg(v.max_accuracy_deg)}</td>
              <td>{formatDeg(v.precision_rms_s2s_deg)}</td>
              <td>{formatDeg(v.precision_sd_deg)}</td>
              <td>{formatPct(v.data_loss_pct)}</td>
              <td>{v.accepted ? 'accepted' : 'not accepted'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="quality-table" aria-label="Drift checks of the session">
        <thead>
          <tr>
            <th scope="col">Time</th>
            <th scope="col">Horizontal</th>
            <th scope="col">Vertical</th>
            <th scope="col">Offset</th>
          </tr>
        </thead>
        <tbody>
          {quality.drift.map((d, i) => (
            <tr key={i}>
              <td>{time(d.time_s)}</td>
              <td>{formatDeg(d.dx_deg)}</td>
              <td>{formatDeg(d.dy_deg)}</td>
              <td>{formatDeg(d.offset_deg)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
