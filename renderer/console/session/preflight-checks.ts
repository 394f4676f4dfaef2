import type { Failure, LiveStatus, PreflightReport, StageStatusEvent } from '../../../app/contract';
import { checkDisplayGeometry, type DisplayGeometry } from '../../../app/core/geometry/display-geometry';
import type { PlannedStep } from '../../../app/core/study/session-plan';
import { formatBytes } from '../format';

export type CheckState = 'ok' | 'failed' | 'waiting';

export interface PreflightCheck {
  readonly id: 'display' | 'stage' | 'disk' | 'gaze';
  readonly label: string;
  readonly state: CheckState;
  readonly detail: string;
}

export interface PreflightInput {
  readonly display: DisplayGeometry;
  readonly stage: StageStatusEvent | null;
  readonly disk: PreflightReport | Failure | null;
  /** Live figures once the recording (and so the gaze source) has started; null before. */
  readonly live: LiveStatus | null;
}

/** How far the measured gaze rate may stray from the source's nominal rate. */
export const RATE_TOLERANCE = 0.1;
/** Seconds per target in a calibration, validation or drift check (the host's default hold). */
const TARGET_SECONDS = 1.5;
/** Time allowed for reading a message screen. */
const MESSAGE_SECONDS = 30;

/** The recording time a plan is expected to take, generously: for the disk check. */
export function expectedSessionSeconds(steps: readonly PlannedStep[], clipSeconds: (stimulusId: string) => number, layoutPoints: number, speed: number): number {
  const seconds = steps.reduce((sum, s) => {
    if (s.kind === 'clip') return sum + (s.stimulusId ? clipSeconds(s.stimulusId) : 0) / speed;
    if (s.kind === 'rest') return sum + (s.seconds ?? 0);
    if (s.kind === 'message') return sum + MESSAGE_SECONDS;
    if (s.kind === 'drift_check') return sum + TARGET_SECONDS;
    return sum + layoutPoints * TARGET_SECONDS;
  }, 0);
  // Repeats, recalibrations and pauses: half as long again, and at least a minute more.
  return Math.ceil(seconds * 1.5 + 60);
}

function displayCheck(display: DisplayGeometry): PreflightCheck {
  const label = 'Display geometry set';
  try {
    checkDisplayGeometry(display);
    return { id: 'display', label, state: 'ok', detail: `${display.widthPx} × ${display.heightPx} px, ${display.widthMm} × ${display.heightMm} mm at ${display.distanceMm} mm` };
  } catch (error) {
    return { id: 'display', label, state: 'failed', detail: (error as Error).message };
  }
}

function stageCheck(stage: StageStatusEvent | null, display: DisplayGeometry): PreflightCheck {
  const label = 'Stage page connected and visible';
  if (!stage?.connected) return { id: 'stage', label, state: 'failed', detail: 'No stage page is connected: open the stage from the Overview screen.' };
  if (!stage.visible) return { id: 'stage', label, state: 'failed', detail: 'The stage page is hidden: a hidden page is throttled, so bring its window to the front.' };
  // Targets and degrees are computed in the display's pixels, so the stage must draw exactly those.
  if (stage.width !== display.widthPx || stage.height !== display.heightPx) {
    return { id: 'stage', label, state: 'failed', detail: `The stage draws ${stage.width} × ${stage.height} px but the display geometry says ${display.widthPx} × ${display.heightPx} px: make the stage full screen on the display, or correct the geometry.` };
  }
  return { id: 'stage', label, state: 'ok', detail: `${stage.width} × ${stage.height} px, ${stage.renderer}` };
}

function diskCheck(disk: PreflightReport | Failure | null): PreflightCheck {
  const label = 'Free disk space for the recording';
  if (disk === null) return { id: 'disk', label, state: 'waiting', detail: 'Asking the host…' };
  if ('ok' in disk) return { id: 'disk', label, state: 'failed', detail: disk.message };
  const detail = `${formatBytes(disk.freeBytes)} free, ${formatBytes(disk.neededBytes)} needed (${disk.recordingsDir})`;
  return { id: 'disk', label, state: disk.freeBytes >= disk.neededBytes ? 'ok' : 'failed', detail };
}

function gazeCheck(live: LiveStatus | null): PreflightCheck {
  const label = 'Gaze source connected at its nominal rate';
  if (!live?.recording) return { id: 'gaze', label, state: 'waiting', detail: 'Connect the gaze source to check it.' };
  const source = live.source;
  if (!source?.connected) return { id: 'gaze', label, state: 'waiting', detail: `${source?.description ?? 'The gaze source'}: not connected yet.` };
  const measured = live.measuredRateHz;
  if (measured === null) return { id: 'gaze', label, state: 'waiting', detail: 'Connected; measuring the sample rate…' };
  const nominal = source.nominalRateHz;
  if (nominal === null) return { id: 'gaze', label, state: measured > 0 ? 'ok' : 'failed', detail: `${measured.toFixed(0)} Hz measured; the source did not say its nominal rate.` };
  const within = Math.abs(measured - nominal) <= RATE_TOLERANCE * nominal;
  return { id: 'gaze', label, state: within ? 'ok' : 'failed', detail: `${measured.toFixed(0)} Hz measured, ${nominal.toFixed(0)} Hz nominal${within ? '' : ` (more than ${RATE_TOLERANCE * 100} % off)`}` };
}

/** The four checks before a session's first step, each with what the operator can do about it. */
export function evaluatePreflight(input: PreflightInput): PreflightCheck[] {
  return [displayCheck(input.display), stageCheck(input.stage, input.display), diskCheck(input.disk), gazeCheck(input.live)];
}

export const allPassed = (checks: readonly PreflightCheck[]): boolean => checks.every((c) => c.state === 'ok');
