/** How the quality screens write their figures: three decimals, so they read the same as `gazeloom quality --json`. */
export const formatDeg = (v: number | null | undefined): string => (v === null || v === undefined || !Number.isFinite(v) ? 'n/a' : `${v.toFixed(3)}°`);
export const formatPct = (v: number | null | undefined): string => (v === null || v === undefined || !Number.isFinite(v) ? 'n/a' : `${v.toFixed(1)} %`);
export const formatRate = (v: number | null | undefined): string => (v === null || v === undefined || !Number.isFinite(v) ? 'n/a' : `${v.toFixed(3)}°/min`);

/** The flag vocabulary in words for the screens (the ids stay as they are in JSON output). */
const flagWords: Record<string, string> = {
  validation_failed: 'validation failed',
  drift_exceeded: 'drift exceeded',
  data_loss_high: 'data loss high',
  drift_rate_high: 'drift rate high',
  no_validation: 'no validation',
  late_frames_high: 'late frames high',
};
export const flagLabel = (flag: string): string => flagWords[flag] ?? flag.replace(/_/g, ' ');
