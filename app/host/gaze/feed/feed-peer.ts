import type { HostNs } from '../../../core/clock/host-clock';
import { FeedLineDecoder, type FeedItem } from '../../../core/gaze/feed';
import type { HostLog } from '../../log';
import type { GazeSink } from '../gaze-source';

/** Garbage lines logged per peer before the log goes quiet about it (the sink still gets every one). */
const LOGGED_GARBAGE = 10;

/**
 * One sender's side of a listener: its own line decoder (each peer has its own hello) and
 * the hand-over of decoded lines to the sink, with the arrival time the transport took.
 */
export class FeedPeer {
  private readonly decoder = new FeedLineDecoder();
  private garbageLines = 0;
  private samples = 0;
  private hellos = 0;

  constructor(
    readonly name: string,
    private readonly sink: GazeSink,
    private readonly log: HostLog,
  ) {}

  /** A datagram or WebSocket frame: whole lines, the last one possibly without a newline. */
  message(data: Uint8Array | string, arrivalNs: HostNs): void {
    this.deliver(this.decoder.push(data), arrivalNs);
    this.deliver(this.decoder.flush(), arrivalNs);
  }

  /** A piece of a TCP stream: lines may be split anywhere. */
  chunk(data: Uint8Array, arrivalNs: HostNs): void {
    this.deliver(this.decoder.push(data), arrivalNs);
  }

  /** The stream ended: a last line without its newline still counts. */
  end(arrivalNs: HostNs): void {
    this.deliver(this.decoder.flush(), arrivalNs);
  }

  summary(): { samples: number; garbageLines: number } {
    return { samples: this.samples, garbageLines: this.garbageLines };
  }

  private deliver(items: readonly FeedItem[], arrivalNs: HostNs): void {
    for (const item of items) {
      if (item.kind === 'sample') {
        this.samples++;
        this.sink.sample(item.sample, arrivalNs);
      } else if (item.kind === 'hello') {
        // A hello after the first: the tracker or its bridge restarted; accepted, and logged as such.
        this.log.info(this.hellos++ > 0 ? 'feed.hello_again' : 'feed.hello', { peer: this.name, ...item.hello });
        this.sink.hello(item.hello, this.name);
      } else {
        this.garbageLines++;
        if (this.garbageLines <= LOGGED_GARBAGE) this.log.warn('feed.garbage', { peer: this.name, reason: item.reason, ...(this.garbageLines === LOGGED_GARBAGE ? { note: 'further garbage from this peer is counted but not logged' } : {}) });
        this.sink.garbage(item.reason, this.name);
      }
    }
  }
}
