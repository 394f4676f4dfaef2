import { useMemo } from 'react';
import type { SessionQuality } from '../../../app/core/quality/session-quality';
import { LinePlot, type Series } from '../plots/LinePlot';
import type { SessionSeries } from './session-series';

const binned = (binS: number, values: readonly (number | null)[]) => ({
  xs: Float64Array.from(values, (_, i) => (i + 0.5) * binS),
  ys: Float64Array.from(values, (v) => (v === null ? Number.NaN : v)),
});

/** Drift, data loss, late frames and the gaze itself over the session, all on the session's time axis (s from the first sample). */
export function QualityPlots({ quality, series, driftDeg, dataLossPct }: { quality: SessionQuality; series: SessionSeries | null; driftDeg: number; dataLossPct: number }) {
  const drift = useMemo<Series[]>(() => {
    const timed = quality.drift.filter((d) => d.time_s !== null && d.offset_deg !== null);
    return [{ label: 'drift', xs: timed.map((d) => d.time_s!), ys: timed.map((d) => d.offset_deg!), colour: '#b5442a' }];
  }, [quality]);
  const loss = useMemo<Series[]>(() => (series?.dataLoss ? [{ label: 'data loss', ...binned(series.dataLoss.binS, series.dataLoss.pct), colour: '#2a6fb5' }] : []), [series]);
  const late = useMemo<Series[]>(() => {
    const f = series?.lateFrames;
    if (!f) return [];
    return [{ label: 'late frames', ...binned(f.binS, f.late.map((n, i) => (f.frames[i]! > 0 ? n : null))), colour: '#8a5a00' }];
  }, [series]);
  const gaze = useMemo<Series[]>(() => {
    const g = series?.gaze;
    if (!g) return [];
    return [
      { label: 'x', xs: g.timeS, ys: g.x, colour: '#2a6fb5' },
      { label: 'y', xs: g.timeS, ys: g.y, colour: '#b5442a' },
    ];
  }, [series]);
  return (
    <div className="quality-plots">
      <LinePlot title="Drift over time" series={drift} xLabel="session time (s)" yLabel="offset, degrees" thresholds={[{ label: `limit ${driftDeg}°`, y: driftDeg, colour: '#b5442a' }]} height={170} />
      <LinePlot title="Data loss over time" series={loss} xLabel="session time (s)" yLabel="% of expected samples" thresholds={[{ label: `limit ${dataLossPct} %`, y: dataLossPct, colour: '#2a6fb5' }]} height={150} />
      <LinePlot title="Late frames over time" series={late} xLabel="session time (s)" yLabel="late frames per bin" height={150} />
      <LinePlot title="Gaze over time" series={gaze} xLabel="session time (s)" yLabel="screen px, x blue and y red" height={200} />
    </div>
  );
}
