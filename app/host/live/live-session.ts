import { randomBytes } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { GazeSourceChoice, LiveStatus, StageCommand, StageEventChunk } from '../../contract';
import type { StageBlank } from '../../contract/schemas/safety';
import type { FrameRecordWire } from '../../contract/schemas/stage';
import type { HostClock, HostNs } from '../../core/clock/host-clock';
import type { DisplayGeometry } from '../../core/geometry/display-geometry';
import { pixelsPerDegreeAtCentre } from '../../core/geometry/display-geometry';
import { placeSensor } from '../../core/geometry/placement';
import type { ControlMessage } from '../../core/gaze/control-message';
import type { GazeUnits } from '../../core/gaze/gaze-sample';
import type { RawCalibrationParams } from '../../core/quality/correction/raw-calibration';
import type { FrameRecord, GazeRecord, MessageRecord } from '../../core/recording/records';
import { parseTracksTsv } from '../../core/tracker-sim';
import { createFeedListener } from '../gaze/feed/create-feed-listener';
import type { GazeSource } from '../gaze/gaze-source';
import { MouseGazeSource } from '../gaze/mouse-source';
import { SimulatedTrackerSource } from '../gaze/simulated-source';
import type { HostLog } from '../log';
import { CompactChunkReader } from '../playback/compact-chunk-reader';
import { PlaybackScheduler, type PlayRequest } from '../playback/playback-scheduler';
import { TestPatternSource, type TestPatternOptions } from '../playback/test-pattern-source';
import type { StimulusStore } from '../stimuli/stimulus-store';
import { GazeIntake } from './gaze-intake';
import { GAZE_CALIBRATION_MESSAGE, lastGazeCalibration } from './last-gaze-calibration';

/** What the live session needs of a recorder (app/host/recording's SessionRecorder). */
export interface SessionWriter {
  appendGaze(record: GazeRecord): void;
  appendFrames(records: readonly FrameRecord[]): void;
  appendMessage(record: MessageRecord): void;
  close(): Promise<void>;
}

export interface LiveSessionDeps {
  readonly clock: HostClock;
  readonly log: HostLog;
  readonly store: StimulusStore;
  readonly recordingsDir: string;
  readonly openRecorder: (dir: string, meta: Record<string, unknown>) => Promise<SessionWriter>;
  /** Opens an existing (recovered) session to append to it. */
  readonly reopenRecorder: (dir: string) => Promise<{ recorder: SessionWriter; sessionId: string; display: DisplayGeometry; source: GazeSourceChoice }>;
  readonly toStage: { command(command: StageCommand): void; events(chunk: StageEventChunk): void };
  readonly publish: (status: LiveStatus) => void;
  /**
   * How the in-host simulated tracker delivers: 'timer' (the default) in real time, or
   * 'manual' in simulated time (tests, the simulated demo study), only when
   * advanceSimulatedTracker is called.
   */
  readonly simulatedDrive?: 'timer' | 'manual';
}

/** What a target procedure needs to know of the recording it runs in. */
export interface GazeContext {
  readonly sessionId: string;
  readonly display: DisplayGeometry;
  /** From the source's hello; null until it has said hello. */
  readonly rateHz: number | null;
  readonly units: GazeUnits | null;
}

interface Running {
  readonly sessionId: string;
  readonly dir: string;
  readonly source: GazeSource;
  readonly recorder: SessionWriter;
  readonly intake: GazeIntake;
  readonly display: DisplayGeometry;
  readonly counts: { frames: number; messages: number };
}

const newSessionId = (): string => `session-${new Date().toISOString().replace(/[-:]/g, '').replace(/\..*/, '').replace('T', '-')}-${randomBytes(2).toString('hex')}`;

/**
 * A live recording: one gaze source feeding the recorder through the clock fit, the stage's
 * frame log, the clip being played and every message, all on the host clock; and the live
 * figures the console shows, published a few times a second.
 */
export class LiveSession {
  readonly scheduler: PlaybackScheduler;
  private running: Running | null = null;
  private mouse: MouseGazeSource | null = null;
  private framesTotal = 0;
  private framesLate = 0;
  private stageClockUncertaintyMs: number | null = null;
  private readonly timer: ReturnType<typeof setInterval>;
  private lastDisplay: DisplayGeometry | null = null;
  private pausedAtUs: number | null = null;
  private targetCount = 0;
  /** Frames of the clip playing now (or last): for the live figures and the stage capacity check. */
  private clipFrames: { total: number; late: number; drawMs: number[] } = { total: 0, late: 0, drawMs: [] };
  /** The stage blank, while it lasts (LiveStatus.blank). */
  private blanked: StageBlank | null = null;

  constructor(private readonly deps: LiveSessionDeps) {
    this.scheduler = new PlaybackScheduler(deps.clock, deps.log, deps.toStage);
    let ticks = 0;
    this.timer = setInterval(() => {
      deps.publish(this.status());
      if (++ticks % 40 === 0) this.running?.intake.recordFit(); // the live clock fit every 10 s
    }, 250);
    this.timer.unref();
  }

  get clock(): HostClock {
    return this.deps.clock;
  }

  get isRecording(): boolean {
    return this.running !== null;
  }

  async startRecording(choice: GazeSourceChoice, display: DisplayGeometry, label?: string): Promise<{ sessionId: string; dir: string }> {
    if (this.running) throw new Error(`a recording is already running (${this.running.sessionId}); stop it first`);
    const sessionId = newSessionId();
    const dir = join(this.deps.recordingsDir, sessionId);
    const recorder = await this.deps.openRecorder(dir, { sessionId, label: label ?? null, display, source: choice, createdAt: new Date().toISOString() });
    return this.begin(sessionId, dir, recorder, choice, display, 'session_started');
  }

  /** Appends to a recovered session with the gaze source and display it was recorded with. */
  async resumeRecording(dir: string): Promise<{ sessionId: string; dir: string }> {
    if (this.running) throw new Error(`a recording is already running (${this.running.sessionId}); stop it first`);
    const calibration = await lastGazeCalibration(dir);
    const { recorder, sessionId, display, source } = await this.deps.reopenRecorder(dir);
    return this.begin(sessionId, dir, recorder, source, display, 'session_resumed', calibration);
  }

  private async begin(sessionId: string, dir: string, recorder: SessionWriter, choice: GazeSourceChoice, display: DisplayGeometry, how: string, calibration: RawCalibrationParams | null = null): Promise<{ sessionId: string; dir: string }> {
    const source = this.makeSource(choice, display);
    const counts = { frames: 0, messages: 0 };
    const intake = new GazeIntake(
      {
        appendGaze: (r) => recorder.appendGaze(r),
        appendMessage: (r) => {
          counts.messages++;
          recorder.appendMessage(r);
        },
      },
      () => this.deps.clock.nowNs(),
    );
    this.running = { sessionId, dir, source, recorder, intake, display, counts };
    this.lastDisplay = display;
    this.message(how, { sessionId, display });
    if (calibration) {
      // Before the source starts, so that no sample of the resumed recording goes unmapped.
      intake.setCalibration(calibration);
      this.message(GAZE_CALIBRATION_MESSAGE, { params: calibration, calibrationId: null, sourceUnits: null, resumed: true });
    }
    source.control({ type: 'session_started', session: sessionId, hostTimeS: this.deps.clock.nowNs() / 1e9 });
    try {
      await source.start(intake);
    } catch (error) {
      this.running = null;
      await recorder.close();
      throw error;
    }
    return { sessionId, dir };
  }

  async stopRecording(): Promise<{ sessionId: string; samples: number; frames: number; messages: number }> {
    const r = this.running;
    if (!r) throw new Error('no recording is running');
    await this.scheduler.stop();
    r.source.control({ type: 'session_ended', session: r.sessionId, hostTimeS: this.deps.clock.nowNs() / 1e9 });
    this.message('session_ended', { sessionId: r.sessionId, samples: r.intake.samples });
    r.intake.end();
    await r.source.stop();
    this.running = null;
    this.mouse = null;
    await r.recorder.close();
    return { sessionId: r.sessionId, samples: r.intake.samples, frames: r.counts.frames, messages: r.counts.messages };
  }

  async play(request: Omit<PlayRequest, 'source' | 'clip'> & { stimulusId: string }): Promise<string> {
    const meta = await this.deps.store.get(request.stimulusId);
    if (!meta) throw new Error(`no stimulus "${request.stimulusId}" in the library`);
    const source = await CompactChunkReader.open(this.deps.store.files(meta.id).events);
    return this.start({ ...request, clip: meta.id, source });
  }

  /** Plays the stage capacity test pattern at a chosen event rate. */
  async playTestPattern(request: Omit<PlayRequest, 'source' | 'clip'> & TestPatternOptions): Promise<string> {
    const source = new TestPatternSource(request);
    return this.start({ ...request, clip: `test-pattern-${Math.round(request.eventsPerSecond)}`, source });
  }

  private async start(request: PlayRequest): Promise<string> {
    if (this.blanked) throw new Error('the stage is blanked: unblank it before playing a clip');
    const playback = await this.scheduler.play(request);
    this.pausedAtUs = null;
    this.clipFrames = { total: 0, late: 0, drawMs: [] };
    return playback.playbackId;
  }

  /** The stage's frame log batch. */
  frames(frames: readonly FrameRecordWire[], clock: { offsetMs: number; uncertaintyMs: number } | null, received: { playbackId: string; lastUs: number | null } | null): void {
    this.framesTotal += frames.length;
    this.framesLate += frames.reduce((n, f) => n + (f.late ? 1 : 0), 0);
    if (clock) this.stageClockUncertaintyMs = clock.uncertaintyMs;
    if (this.running) {
      this.running.recorder.appendFrames(frames);
      this.running.counts.frames += frames.length;
    }
    for (const f of frames) {
      if (f.clip === null) continue;
      this.clipFrames.total++;
      if (f.late) this.clipFrames.late++;
      if (f.drawMs !== undefined && this.clipFrames.drawMs.length < 100_000) this.clipFrames.drawMs.push(f.drawMs);
    }
    const playback = this.scheduler.playback;
    const last = [...frames].reverse().find((f) => f.clip !== null && f.stimulusUs !== null);
    if (playback) this.scheduler.progress(playback.playbackId, last?.stimulusUs ?? null, received?.playbackId === playback.playbackId ? received.lastUs : null);
  }

  /** The stage reported a playback state change (its host time is the frame's). */
  async playbackReport(report: { playbackId: string; state: 'started' | 'paused' | 'resumed' | 'ended' | 'stopped' | 'failed'; hostNs: number; stimulusUs: number | null; message?: string }): Promise<void> {
    const playback = this.scheduler.playback;
    if (!playback || playback.playbackId !== report.playbackId) return;
    const display = this.running?.display ?? this.lastDisplay;
    const placement = display ? placeSensor(playback.sensor, display, playback.placement) : null;
    const hostTimeS = report.hostNs / 1e9;
    if (report.state === 'started') {
      playback.state = 'playing';
      this.message('clip_start', { clip: playback.clip, playbackId: playback.playbackId, speed: playback.speed, stimulusUs: report.stimulusUs, placement, display }, report.hostNs);
      this.control({ type: 'clip_started', clip: playback.clip, hostTimeS });
      void this.lookAtClip(playback.clip, placement, hostTimeS - (report.stimulusUs ?? 0) / 1e6 / playback.speed, playback.speed);
    } else if (report.state === 'paused') {
      this.pausedAtUs = playback.stimulusUs;
      this.message('clip_pause', { clip: playback.clip }, report.hostNs);
      this.lookAt({ kind: 'idle' });
    } else if (report.state === 'resumed') {
      this.message('clip_resume', { clip: playback.clip }, report.hostNs);
      if (this.pausedAtUs !== null) void this.lookAtClip(playback.clip, placement, hostTimeS - this.pausedAtUs / 1e6 / playback.speed, playback.speed);
    } else {
      this.message('clip_end', { clip: playback.clip, playbackId: playback.playbackId, how: report.state, stimulusUs: report.stimulusUs, note: report.message ?? null }, report.hostNs);
      this.control({ type: 'clip_ended', clip: playback.clip, hostTimeS });
      this.lookAt({ kind: 'idle' });
    }
    await this.scheduler.reported(report.playbackId, report.state === 'started' ? 'playing' : report.state === 'resumed' ? 'playing' : report.state);
  }

  /** Stops the clip now (the stage goes back to grey) and records its end. */
  async stopClip(): Promise<void> {
    const playback = this.scheduler.playback;
    if (!playback) return;
    const hostNs = this.deps.clock.nowNs();
    this.message('clip_end', { clip: playback.clip, playbackId: playback.playbackId, how: 'stopped', stimulusUs: playback.stimulusUs, note: null }, hostNs);
    this.control({ type: 'clip_ended', clip: playback.clip, hostTimeS: hostNs / 1e9 });
    this.lookAt({ kind: 'idle' });
    await this.scheduler.stop();
  }

  get blank(): StageBlank | null {
    return this.blanked;
  }

  /**
   * Blanks the stage to mid-grey and pauses the clip, at once; recorded as stage_blanked
   * (who, why, the clip and its time). A second blank while blanked changes nothing but
   * sends the stage its blank again. The caller cancels a running target procedure.
   */
  blankStage(by: StageBlank['by'], reason: string): StageBlank {
    this.deps.toStage.command({ type: 'setBlank', blanked: true });
    if (this.blanked) return this.blanked;
    const hostNs = this.deps.clock.nowNs();
    const playback = this.scheduler.playback;
    if (playback && (playback.state === 'playing' || playback.state === 'starting')) this.scheduler.pause();
    this.blanked = { by, reason, hostNs };
    this.message('stage_blanked', { by, reason, clip: playback?.clip ?? null, stimulusUs: playback?.stimulusUs ?? null }, hostNs);
    this.lookAt({ kind: 'idle' });
    this.deps.publish(this.status());
    return this.blanked;
  }

  /** Ends the blank (recorded as stage_unblanked); a paused clip stays paused until resumed or stopped. */
  unblankStage(): void {
    const blank = this.blanked;
    if (!blank) return;
    const hostNs = this.deps.clock.nowNs();
    this.blanked = null;
    this.deps.toStage.command({ type: 'setBlank', blanked: false });
    this.message('stage_unblanked', { blankedBy: blank.by, blankedForS: (hostNs - blank.hostNs) / 1e9 }, hostNs);
    this.deps.publish(this.status());
  }

  /** Shows a target: drawn by the stage, recorded, sent to a tracker bridge, and looked at by the simulated tracker. */
  showTarget(x: number, y: number, purpose: 'calibration' | 'validation' | 'drift_check'): string {
    const id = `target-${++this.targetCount}`;
    const hostNs = this.deps.clock.nowNs();
    const display = this.running?.display ?? this.lastDisplay;
    // Sizes in degrees of visual angle: 1.0° drawing the eye, shrinking to 0.3° over 500 ms.
    const ppd = display ? pixelsPerDegreeAtCentre(display) : 38;
    this.deps.toStage.command({ type: 'showTarget', id, x, y, outerPx: 0.5 * ppd, innerPx: 0.15 * ppd, shrinkMs: 500 });
    this.message('target_shown', { id, x, y, purpose }, hostNs);
    this.control({ type: 'target_shown', purpose, id, x, y, hostTimeS: hostNs / 1e9 });
    this.lookAt({ kind: 'point', x, y });
    return id;
  }

  hideTarget(id: string): void {
    const hostNs = this.deps.clock.nowNs();
    this.deps.toStage.command({ type: 'hideTarget', id });
    this.message('target_removed', { id }, hostNs);
    this.control({ type: 'target_removed', id, hostTimeS: hostNs / 1e9 });
    this.lookAt({ kind: 'idle' });
  }

  /** The running recording's session, display and gaze units and rate; null when none is running. */
  gazeContext(): GazeContext | null {
    const r = this.running;
    if (!r) return null;
    const hello = r.intake.helloSeen;
    // Raw samples mapped by Gazeloom's calibration arrive in screen px.
    return { sessionId: r.sessionId, display: r.display, rateHz: hello?.rateHz ?? null, units: r.intake.mapping ? 'screen_px' : (hello?.units ?? null) };
  }

  /**
   * Sets (or with null clears) Gazeloom's calibration of a source that sends raw
   * coordinates, recorded as a gaze_calibration_set message ({params, calibrationId, sourceUnits}). Throws when no recording is
   * running or the source's hello did not declare raw units (its samples are already on the screen).
   */
  setGazeCalibration(params: RawCalibrationParams | null, calibrationId: string | null): { sourceUnits: GazeUnits | null; mapping: boolean } {
    const r = this.running;
    if (!r) throw new Error('no recording is running: start one before calibrating');
    const sourceUnits = r.intake.helloSeen?.units ?? null;
    if (params && sourceUnits !== 'raw') throw new Error(`the gaze source sends ${sourceUnits ?? 'nothing yet (no hello)'}, not raw coordinates: it needs no calibration by Gazeloom`);
    // Clearing when nothing was set changes nothing, and is not recorded.
    if (params || r.intake.hasCalibration) this.message(GAZE_CALIBRATION_MESSAGE, { params, calibrationId, sourceUnits });
    r.intake.setCalibration(params);
    return { sourceUnits, mapping: r.intake.mapping };
  }

  /** Every gaze sample of the running recording from now on, with its mapped host time (GazeIntake.tap). */
  tapGaze(listener: (record: GazeRecord) => void): () => void {
    if (!this.running) throw new Error('no recording is running');
    return this.running.intake.tap(listener);
  }

  /** Records a message in the running recording (nothing when none is running). */
  recordMessage(kind: string, data: Record<string, unknown>): void {
    this.message(kind, data);
  }

  /** Simulated time: the in-host simulated tracker delivers every sample due by untilNs (see simulatedDrive). */
  advanceSimulatedTracker(untilNs: HostNs): number {
    const source = this.running?.source;
    return source instanceof SimulatedTrackerSource ? source.advanceTo(untilNs) : 0;
  }

  setPhotodiode(enabled: boolean): void {
    this.deps.toStage.command({ type: 'setPhotodiode', enabled });
  }

  mouseSamples(samples: readonly { stageTimeMs: number; x: number; y: number; inside: boolean }[]): void {
    this.mouse?.deliver(samples);
  }

  status(): LiveStatus {
    const r = this.running;
    const now = this.deps.clock.nowNs();
    const figures = r?.intake.monitor.figures(now, true) ?? null;
    const mapping = r?.intake.fit.mapping() ?? null;
    const playback = this.scheduler.playback;
    return {
      recording: r ? { sessionId: r.sessionId, dir: r.dir, samples: r.intake.samples, frames: r.counts.frames } : null,
      source: r ? { kind: r.source.kind, description: r.source.description, connected: r.intake.connected, nominalRateHz: r.intake.helloSeen?.rateHz ?? null } : null,
      measuredRateHz: figures?.measuredRateHz ?? null,
      dataLossPct10s: figures?.dataLossPct10s ?? null,
      clockOffsetS: mapping ? mapping.offsetS : null,
      clockUncertaintyMs: mapping ? mapping.uncertaintyS * 1000 : null,
      stageClockUncertaintyMs: this.stageClockUncertaintyMs,
      framesTotal: this.framesTotal,
      framesLate: this.framesLate,
      garbageLines: r?.intake.garbageLines ?? 0,
      lastSampleAgeMs: figures?.lastSampleAgeMs ?? null,
      alarm: figures?.alarm ?? false,
      trail: figures?.trail ?? [],
      playback: playback ? { playbackId: playback.playbackId, clip: playback.clip, state: playback.state, stimulusUs: playback.stimulusUs, sensor: playback.sensor, placement: playback.placement } : null,
      clipFrames: this.clipFrameFigures(),
      display: r?.display ?? this.lastDisplay,
      blank: this.blanked,
    };
  }

  private clipFrameFigures(): LiveStatus['clipFrames'] {
    const { total, late, drawMs } = this.clipFrames;
    if (total === 0) return null;
    const sorted = [...drawMs].sort((a, b) => a - b);
    const at = (q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]! : null);
    return { frames: total, late, drawMsP50: at(0.5), drawMsP99: at(0.99) };
  }

  async dispose(): Promise<void> {
    clearInterval(this.timer);
    if (this.running) await this.stopRecording();
  }

  private makeSource(choice: GazeSourceChoice, display: DisplayGeometry): GazeSource {
    const { clock, log } = this.deps;
    if (choice.kind === 'feed') return createFeedListener(choice.url, { clock, log });
    if (choice.kind === 'mouse') {
      this.mouse = new MouseGazeSource(clock, display, (enabled) => this.deps.toStage.command({ type: 'setMouseGaze', enabled }));
      return this.mouse;
    }
    const { kind: _kind, ...tracker } = choice;
    return new SimulatedTrackerSource({ clock, tracker: { ...tracker, display }, drive: this.deps.simulatedDrive ?? 'timer' });
  }

  private message(kind: string, data: Record<string, unknown>, hostNs: number = this.deps.clock.nowNs()): void {
    if (!this.running) return;
    this.running.counts.messages++;
    this.running.recorder.appendMessage({ hostNs, kind, data });
  }

  private control(message: ControlMessage): void {
    this.running?.source.control(message);
  }

  private lookAt(target: Parameters<SimulatedTrackerSource['setLook']>[0]): void {
    const source = this.running?.source;
    if (source instanceof SimulatedTrackerSource) source.setLook(target);
  }

  /** Points the simulated participant at the clip's tracked objects, when the clip has tracks. */
  private async lookAtClip(clip: string, placement: ReturnType<typeof placeSensor> | null, clipStartHostS: number, speed: number): Promise<void> {
    const source = this.running?.source;
    if (!(source instanceof SimulatedTrackerSource) || !placement) return;
    const meta = await this.deps.store.get(clip);
    if (!meta?.hasTracks) return this.lookAt({ kind: 'idle' });
    const path = this.deps.store.files(clip).tracks;
    const tracks = parseTracksTsv(await readFile(path, 'utf8'), path);
    source.setLook({ kind: 'clip', tracks, placement, clipStartHostS, speed });
  }
}
