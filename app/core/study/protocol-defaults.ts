import type { ProtocolRecord } from './records';

/**
 * Acceptance thresholds a new protocol starts with: validation mean accuracy 1.0°, worst point
 * 1.5°, drift 1.5° (conventions; REFERENCES.md §3 notes that > 1° usually means recalibrate).
 */
export const DEFAULT_THRESHOLDS: ProtocolRecord['thresholds'] = { validationMeanDeg: 1.0, validationMaxDeg: 1.5, driftDeg: 1.5 };

/** The playback speeds offered for clips, slowest first. */
export const PLAYBACK_SPEEDS: readonly number[] = [0.1, 0.25, 0.5, 0.75, 1];
