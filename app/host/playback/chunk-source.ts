import type { SensorSize, TimeResolution } from '../../core/events/event-batch';
import type { CompactEventChunk } from '../../core/playback/event-chunk-queue';

/** A clip as the scheduler plays it: its extent and chunk times up front, then chunks on demand. */
export interface ChunkSource {
  readonly name: string;
  readonly sensor: SensorSize;
  readonly resolution: TimeResolution;
  readonly eventCount: number;
  readonly tStartUs: number;
  readonly tEndUs: number;
  readonly chunkCount: number;
  /** The first event time of chunk k (to stream a fixed window ahead). */
  chunkStartUs(k: number): number;
  read(k: number): Promise<CompactEventChunk>;
  close(): Promise<void>;
}
