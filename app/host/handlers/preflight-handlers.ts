import { mkdir, statfs } from 'node:fs/promises';
import type { GazeloomHandlers } from '../../contract';
import { fail } from '../../contract/result';
import { FRAME_RECORD_BYTES } from '../../core/recording/frame-codec';
import { GAZE_RECORD_BYTES } from '../../core/recording/gaze-codec';

/** The stage's frame log at up to 240 Hz (a high-refresh lab display). */
const MAX_FRAME_RATE_HZ = 240;
/** Chunk headers, the index, messages and the clock fit, over the raw records. */
const OVERHEAD_FACTOR = 2;
/** Room the system and the lab archive backup need on top of the recording itself. */
const HEADROOM_BYTES = 256 * 2 ** 20;

/** Bytes a recording of `seconds` at `rateHz` needs on disk, rounded up generously. */
export function expectedRecordingBytes(seconds: number, rateHz: number): number {
  const perSecond = rateHz * GAZE_RECORD_BYTES + MAX_FRAME_RATE_HZ * FRAME_RECORD_BYTES;
  return Math.ceil(seconds * perSecond * OVERHEAD_FACTOR) + HEADROOM_BYTES;
}

/** Pre-flight facts the session console checks before the first step. */
export function preflightHandlers(recordingsDir: string): Pick<GazeloomHandlers, 'getPreflight'> {
  return {
    getPreflight: async ({ expectedSeconds, rateHz }) => {
      try {
        await mkdir(recordingsDir, { recursive: true });
        const fs = await statfs(recordingsDir);
        // bavail: blocks free to an unprivileged user (bfree also counts the root reserve).
        return { freeBytes: fs.bavail * fs.bsize, neededBytes: expectedRecordingBytes(expectedSeconds, rateHz), recordingsDir };
      } catch (error) {
        return fail('unavailable', `cannot read the free space of ${recordingsDir}: ${(error as Error).message}`);
      }
    },
  };
}
