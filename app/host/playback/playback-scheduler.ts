import type { StageCommand, StageEventChunk } from '../../contract';
import type { HostClock } from '../../core/clock/host-clock';
import type { HostLog } from '../log';
import type { ChunkSource } from './chunk-source';

export interface PlayRequest {
  /** The clip's id in messages and the frame log (a stimulus id, or a test pattern's name). */
  readonly clip: string;
  readonly source: ChunkSource;
  readonly speed: number;
  readonly look: 'polarity' | 'decay' | 'grey';
  readonly placement: 'fit' | '1:1' | 'integer';
}

export interface Playback {
  readonly playbackId: string;
  readonly clip: string;
  readonly sensor: { width: number; height: number };
  readonly placement: PlayRequest['placement'];
  readonly speed: number;
  readonly startAtHostNs: number;
  state: 'starting' | 'playing' | 'paused' | 'ended' | 'stopped' | 'failed';
  stimulusUs: number | null;
}

/**
 * How far ahead of the stage the host streams, in stimulus time: past what it has shown,
 * and past what it reports having received (so a stage that cannot keep up is never
 * buried under data in flight); and the lead before the first frame.
 */
const AHEAD_US = 600_000;
const IN_FLIGHT_US = 300_000;
const LEAD_NS = 400e6;

/**
 * Plays a clip on the stage at true timing: tells the stage when the clip's first instant
 * is to be shown (a little in the future, so the first events are there in time), then
 * streams the clip's chunks in time order, staying a fixed stimulus-time window ahead of
 * what the stage reports it has shown. Never more than that window is in flight, so a clip
 * of any length plays from a file of any size.
 */
export class PlaybackScheduler {
  private current: { playback: Playback; reader: ChunkSource; nextChunk: number; pumping: boolean; receivedUs: number | null } | null = null;
  private nextId = 1;

  constructor(
    private readonly clock: HostClock,
    private readonly log: HostLog,
    private readonly toStage: { command(command: StageCommand): void; events(chunk: StageEventChunk): void },
  ) {}

  get playback(): Playback | null {
    return this.current?.playback ?? null;
  }

  async play(request: PlayRequest): Promise<Playback> {
    await this.stop();
    const reader = request.source;
    const info = reader;
    if (info.eventCount === 0) {
      await reader.close();
      throw new Error(`${request.clip} has no events to play`);
    }
    const playback: Playback = {
      playbackId: `play-${this.nextId++}`,
      clip: request.clip,
      sensor: info.sensor,
      placement: request.placement,
      speed: request.speed,
      startAtHostNs: this.clock.nowNs() + LEAD_NS,
      state: 'starting',
      stimulusUs: null,
    };
    this.current = { playback, reader, nextChunk: 0, pumping: false, receivedUs: null };
    this.toStage.command({
      type: 'prepareClip',
      playbackId: playback.playbackId,
      clip: request.clip,
      sensor: info.sensor,
      tStartUs: info.tStartUs,
      tEndUs: info.tEndUs,
      speed: request.speed,
      look: request.look,
      placement: request.placement,
      startAtHostNs: playback.startAtHostNs,
    });
    await this.pump();
    return playback;
  }

  /** The stage has shown stimulus time t and received events up to receivedUs: keep the window ahead filled. */
  progress(playbackId: string, stimulusUs: number | null, receivedUs: number | null): void {
    const c = this.current;
    if (!c || c.playback.playbackId !== playbackId) return;
    if (stimulusUs !== null) c.playback.stimulusUs = stimulusUs;
    if (receivedUs !== null) c.receivedUs = receivedUs;
    void this.pump();
  }

  pause(): void {
    if (this.current) this.toStage.command({ type: 'pauseClip', playbackId: this.current.playback.playbackId });
  }

  resume(): void {
    if (this.current) this.toStage.command({ type: 'resumeClip', playbackId: this.current.playback.playbackId });
  }

  /** The stage reported a state change; an ended or stopped clip releases its file. */
  async reported(playbackId: string, state: Playback['state']): Promise<void> {
    const c = this.current;
    if (!c || c.playback.playbackId !== playbackId) return;
    c.playback.state = state;
    if (state === 'ended' || state === 'stopped' || state === 'failed') {
      this.current = null;
      await c.reader.close();
    }
  }

  async stop(): Promise<void> {
    const c = this.current;
    if (!c) return;
    this.current = null;
    c.playback.state = 'stopped';
    this.toStage.command({ type: 'stopClip', playbackId: c.playback.playbackId });
    await c.reader.close();
  }

  private async pump(): Promise<void> {
    const c = this.current;
    if (!c || c.pumping) return;
    c.pumping = true;
    try {
      const source = c.reader;
      // Recomputed for every chunk: progress may arrive while reading.
      const wanted = () => Math.min((c.playback.stimulusUs ?? source.tStartUs) + AHEAD_US, (c.receivedUs ?? source.tStartUs) + AHEAD_US + IN_FLIGHT_US);
      while (this.current === c && c.nextChunk < source.chunkCount && source.chunkStartUs(c.nextChunk) <= wanted()) {
        const k = c.nextChunk++;
        const chunk = await source.read(k);
        if (this.current !== c) break;
        this.toStage.events({ playbackId: c.playback.playbackId, ...chunk, ticksPerUs: chunk.ticksPerUs === 1000 ? 1000 : 1, last: k === source.chunkCount - 1 });
      }
    } catch (error) {
      this.log.error('playback.read_failed', { clip: c.playback.clip, message: (error as Error).message });
      c.playback.state = 'failed';
      await this.stop();
    } finally {
      c.pumping = false;
    }
  }
}
