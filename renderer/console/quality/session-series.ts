import type { GazeloomApi } from '../../../app/contract';

/** What the host reads from a session's recording for the quality screens (getSessionQuality). */
export interface SessionSeries {
  readonly firstSampleHostNs: number | null;
  readonly dataLoss: { readonly binS: number; readonly pct: readonly (number | null)[]; readonly overallPct: number | null } | null;
  readonly lateFrames: { readonly binS: number; readonly late: readonly number[]; readonly frames: readonly number[]; readonly totalFrames: number; readonly totalLate: number } | null;
  /** Gaze over time, s from the first sample and screen px, NaN where invalid. */
  readonly gaze: { readonly timeS: ArrayLike<number>; readonly x: ArrayLike<number>; readonly y: ArrayLike<number> } | null;
}

export type SeriesResult = { ok: true; series: SessionSeries } | { ok: false; message: string };

/** The frame log's totals (every frame, also those before the first gaze sample), the form sessionQuality takes. */
export function lateFrameTotals(series: SessionSeries | null): { frames: number; late: number } | null {
  const f = series?.lateFrames;
  return f ? { frames: f.totalFrames, late: f.totalLate } : null;
}

/** The session's series from the host; the gaze itself only when asked (it is one value per sample). */
export async function fetchSessionSeries(api: GazeloomApi, sessionId: string, withGaze = false): Promise<SeriesResult> {
  const r = await api.getSessionQuality({ sessionId, gaze: withGaze });
  if (!r.ok) return { ok: false, message: r.message };
  const v = r.value;
  return { ok: true, series: { firstSampleHostNs: v.firstSampleHostNs, dataLoss: v.dataLoss, lateFrames: v.lateFrames, gaze: v.gaze ?? null } };
}
