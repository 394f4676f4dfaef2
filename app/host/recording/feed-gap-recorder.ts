import type { GapEndData, GapStartData } from '../../core/recording/message-kinds';
import { MESSAGE_KINDS } from '../../core/recording/message-kinds';
import type { MessageRecord } from '../../core/recording/records';

/**
 * Turns a gaze source's connection events into the session's record of them: a
 * tracker_connection message for every change, and a gap_start / gap_end pair around each
 * stretch without gaze, from the disconnection to the first sample after it (the gap ends
 * when data resumes, not when the socket does). The tracker times on either side go into
 * the messages, so `recording inspect` can report the gap in tracker time.
 */
export class FeedGapRecorder {
  private lastTrackerTimeS: number | null = null;
  /** The peer whose disconnection opened the current gap, or null when none is open. */
  private gapPeer: string | null = null;
  private disconnectCount = 0;

  constructor(private readonly appendMessage: (record: MessageRecord) => void) {}

  get disconnects(): number {
    return this.disconnectCount;
  }

  connection(state: 'connected' | 'disconnected', peer: string, hostNs: number): void {
    this.appendMessage({ hostNs, kind: MESSAGE_KINDS.trackerConnection, data: { state, peer } });
    if (state === 'disconnected' && this.gapPeer === null) {
      this.disconnectCount++;
      this.gapPeer = peer;
      const data: GapStartData = { peer, reason: 'disconnected', lastTrackerTimeS: this.lastTrackerTimeS };
      this.appendMessage({ hostNs, kind: MESSAGE_KINDS.gapStart, data: { ...data } });
    }
  }

  /** Call before recording each sample; closes an open gap with the sample's tracker time. */
  sample(trackerTimeS: number, arrivalNs: number): void {
    if (this.gapPeer !== null) {
      const data: GapEndData = { peer: this.gapPeer, firstTrackerTimeS: trackerTimeS };
      this.appendMessage({ hostNs: arrivalNs, kind: MESSAGE_KINDS.gapEnd, data: { ...data } });
      this.gapPeer = null;
    }
    this.lastTrackerTimeS = trackerTimeS;
  }
}
