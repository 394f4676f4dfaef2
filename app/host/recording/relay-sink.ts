import type { HostNs } from '../../core/clock/host-clock';
import type { GazeHello, GazeSample } from '../../core/gaze/gaze-sample';
import type { GazeSink } from '../gaze/gaze-source';

/**
 * A sink to start a source with before its real sink exists: what arrives meanwhile is held
 * (in order) and delivered on attach. After end(), everything is dropped, so a source's
 * last events while it stops (a UDP listener reports its senders disconnected then) are
 * not taken for a disconnection during the recording.
 */
export class RelaySink implements GazeSink {
  private target: GazeSink | null = null;
  private held: ((sink: GazeSink) => void)[] = [];
  private ended = false;

  attach(sink: GazeSink): void {
    this.target = sink;
    for (const deliver of this.held) deliver(sink);
    this.held = [];
  }

  end(): void {
    this.ended = true;
    this.target = null;
    this.held = [];
  }

  hello(hello: GazeHello, peer: string): void {
    this.pass((s) => s.hello(hello, peer));
  }

  sample(sample: GazeSample, arrivalNs: HostNs): void {
    this.pass((s) => s.sample(sample, arrivalNs));
  }

  garbage(reason: string, peer: string): void {
    this.pass((s) => s.garbage(reason, peer));
  }

  connection(state: 'connected' | 'disconnected', peer: string): void {
    this.pass((s) => s.connection(state, peer));
  }

  private pass(deliver: (sink: GazeSink) => void): void {
    if (this.ended) return;
    if (this.target) deliver(this.target);
    else this.held.push(deliver);
  }
}
