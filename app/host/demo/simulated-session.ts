import type { GazeSourceChoice } from '../../contract';
import { ManualClock } from '../../core/clock/host-clock';
import type { DisplayGeometry } from '../../core/geometry/display-geometry';
import { placeSensor } from '../../core/geometry/placement';
import { summarizeDriftCheck, summarizeValidation, validationLayout } from '../../core/quality';
import type { PlannedStep } from '../../core/study/session-plan';
import type { ProtocolRecord, RecordOf, TargetResult, TrialRecord } from '../../core/study/records';
import type { TrackTable } from '../../core/tracker-sim';
import { SimulatedTrackerSource } from '../gaze/simulated-source';
import { GazeIntake } from '../live/gaze-intake';
import { TargetProcedures } from '../live/target-procedure';
import type { FlushTimer } from '../recording/flush-timer';
import { SessionRecorder } from '../recording/session-recorder';
import { DemoStage } from './demo-stage';

export type SimulatedTrackerChoice = Extract<GazeSourceChoice, { kind: 'simulated' }>;

export interface DemoClip {
  readonly durationS: number;
  readonly sensor: { width: number; height: number };
  readonly tracks: TrackTable;
}

export interface SimulatedSessionInput {
  readonly dir: string;
  readonly sessionId: string;
  readonly label: string;
  readonly display: DisplayGeometry;
  readonly tracker: SimulatedTrackerChoice;
  readonly steps: readonly PlannedStep[];
  readonly protocol: ProtocolRecord;
  readonly clips: ReadonlyMap<string, DemoClip>;
  /** Wall-clock time at which the session starts. */
  readonly startedAt: Date;
  /** Seeds the order of calibration and validation targets. */
  readonly targetSeed: number;
}

export interface SimulatedSessionOutcome {
  readonly endedAt: string;
  readonly samples: number;
  readonly trials: TrialRecord[];
  readonly calibrations: RecordOf<'calibrations'>[];
  readonly validations: RecordOf<'validations'>[];
  /** Steps whose quality check failed, with the reasons (the console would offer a recalibration). */
  readonly failedChecks: { index: number; reasons: string[] }[];
}

const START_NS = 5e9;
const MESSAGE_SCREEN_MS = 4000;
/** The recorder's flushes are driven by the simulation (flush at the end of each step), not a timer. */
const noTimer: FlushTimer = () => ({ cancel: () => undefined });
const targetResultOnly = ({ x, y, accuracyDeg, precisionRmsS2SDeg, precisionSdDeg, dataLossPct, samples, dxDeg, dyDeg }: TargetResult): TargetResult => ({ x, y, accuracyDeg, precisionRmsS2SDeg, precisionSdDeg, dataLossPct, samples, dxDeg, dyDeg });

/**
 * One session of the demo study in simulated time: the recorder, the simulated tracker and
 * the target procedures the console uses, driven step by step through the session plan.
 * Writes a closed session folder in `dir` and returns the lab records the console would
 * have written (trials, calibrations, validations).
 */
export async function runSimulatedSession(input: SimulatedSessionInput): Promise<SimulatedSessionOutcome> {
  const { sessionId, display, protocol } = input;
  const clock = new ManualClock(START_NS);
  const wall = (ns: number) => new Date(input.startedAt.getTime() + (ns - START_NS) / 1e6);
  const recorder = await SessionRecorder.create(
    input.dir,
    { sessionId, display, metadata: { sessionId, label: input.label, display, source: input.tracker, createdAt: input.startedAt.toISOString() } },
    { clock, timer: noTimer, syncEveryFlushes: 0, wallClock: () => wall(clock.nowNs()) },
  );
  const { kind: _kind, ...trackerOptions } = input.tracker;
  const source = new SimulatedTrackerSource({ clock, tracker: { ...trackerOptions, display }, drive: 'manual' });
  const intake = new GazeIntake(recorder, () => clock.nowNs());
  const stage = new DemoStage(clock, recorder, source, intake, { sessionId, display, rateHz: input.tracker.rateHz });
  const procedures = new TargetProcedures(stage, { sleep: async (ms) => stage.wait(ms) });
  const at = (ns: number) => wall(ns).toISOString();

  stage.recordMessage('session_started', { sessionId, display });
  await source.start(intake);
  const trials: TrialRecord[] = [];
  const calibrations: RecordOf<'calibrations'>[] = [];
  const validations: RecordOf<'validations'>[] = [];
  const failedChecks: SimulatedSessionOutcome['failedChecks'] = [];
  const everyPoint = validationLayout(protocol.validationLayout, display);
  const centre = [{ x: display.widthPx / 2, y: display.heightPx / 2 }];

  for (const step of input.steps) {
    const trialId = `${sessionId}-trial-${step.index}`;
    const startedHostNs = clock.nowNs();
    if (step.kind === 'calibrate' || step.kind === 'validate' || step.kind === 'drift_check') {
      const purpose = step.kind === 'calibrate' ? 'calibration' : step.kind === 'validate' ? 'validation' : 'drift_check';
      const result = await procedures.run({ purpose, points: step.kind === 'drift_check' ? centre : everyPoint, order: step.kind === 'drift_check' ? 'as_given' : 'random', seed: input.targetSeed + step.index });
      if ('ok' in result) throw new Error(`simulated ${purpose} failed: ${result.message}`);
      const points = result.points.map(targetResultOnly);
      const hostNs = result.startedHostNs;
      if (step.kind === 'calibrate') {
        calibrations.push({ id: `${sessionId}-calibration-${step.index}`, sessionId, trialId, at: at(hostNs), hostNs, method: 'tracker', points });
      } else if (step.kind === 'validate') {
        const s = summarizeValidation(points, protocol.thresholds);
        validations.push({ id: `${sessionId}-validation-${step.index}`, sessionId, trialId, kind: 'validation', at: at(hostNs), hostNs, points, meanAccuracyDeg: s.meanAccuracyDeg, maxAccuracyDeg: s.maxAccuracyDeg, accepted: s.accepted });
        if (!s.accepted) failedChecks.push({ index: step.index, reasons: s.reasons });
      } else {
        const d = summarizeDriftCheck(points, protocol.thresholds);
        const offset = d.offset?.offsetDeg ?? null;
        validations.push({ id: `${sessionId}-drift-${step.index}`, sessionId, trialId, kind: 'drift_check', at: at(hostNs), hostNs, points, meanAccuracyDeg: offset, maxAccuracyDeg: offset, accepted: d.accepted });
        if (!d.accepted) failedChecks.push({ index: step.index, reasons: d.reasons });
      }
    } else if (step.kind === 'clip') {
      playClip(stage, step.stimulusId!, input.clips, display, protocol.speed);
    } else if (step.kind === 'rest') {
      stage.wait(step.seconds! * 1000);
    } else {
      stage.wait(MESSAGE_SCREEN_MS);
    }
    trials.push({ id: trialId, sessionId, index: step.index, kind: step.kind, stimulusId: step.stimulusId, state: 'done', startedHostNs, endedHostNs: clock.nowNs(), badReason: null });
    await recorder.flush();
  }

  stage.recordMessage('session_ended', { sessionId, samples: intake.samples });
  intake.end();
  await source.stop();
  const samples = intake.samples;
  await recorder.close();
  return { endedAt: at(clock.nowNs()), samples, trials, calibrations, validations, failedChecks };
}

/** A clip as LiveSession records it: clip_start with speed and placement, the participant watching its objects, clip_end. */
function playClip(stage: DemoStage, clipId: string, clips: ReadonlyMap<string, DemoClip>, display: DisplayGeometry, speed: number): void {
  const clip = clips.get(clipId);
  if (!clip) throw new Error(`the demo has no clip "${clipId}"`);
  const placement = placeSensor(clip.sensor, display, 'fit');
  const playbackId = `playback-${clipId}-${stage.clock.nowNs()}`;
  const startNs = stage.clock.nowNs();
  stage.recordMessage('clip_start', { clip: clipId, playbackId, speed, stimulusUs: 0, placement, display });
  stage.lookAt({ kind: 'clip', tracks: clip.tracks, placement, clipStartHostS: startNs / 1e9, speed });
  stage.show({ clip: clipId, speed });
  stage.wait((clip.durationS * 1000) / speed);
  stage.show(null);
  stage.recordMessage('clip_end', { clip: clipId, playbackId, how: 'ended', stimulusUs: clip.durationS * 1e6, note: null });
  stage.lookAt({ kind: 'idle' });
}
