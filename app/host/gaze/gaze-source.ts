import type { ControlMessage } from '../../core/gaze/control-message';
import type { GazeHello, GazeSample } from '../../core/gaze/gaze-sample';
import type { HostNs } from '../../core/clock/host-clock';

/** What every gaze source delivers, whatever its transport. */
export interface GazeSink {
  hello(hello: GazeHello, peer: string): void;
  /** A sample in screen pixels (screen_norm already converted) or raw units, with its arrival time. */
  sample(sample: GazeSample, arrivalNs: HostNs): void;
  /** A line that was not a hello or a sample: counted and reported, never fatal. */
  garbage(reason: string, peer: string): void;
  connection(state: 'connected' | 'disconnected', peer: string): void;
}

/**
 * One interface for every gaze source: the network feed (UDP, TCP, WebSocket), the
 * simulated tracker inside the host, replay of a recorded file, and the mouse on the stage.
 * The recorder and the console never know which one is connected.
 */
export interface GazeSource {
  readonly kind: 'feed-udp' | 'feed-tcp' | 'feed-ws' | 'simulated' | 'replay' | 'mouse';
  /** For the operator, e.g. "UDP feed on 127.0.0.1:4242". */
  readonly description: string;
  start(sink: GazeSink): Promise<void>;
  stop(): Promise<void>;
  /** Sends a control message to connected trackers (TCP and WebSocket feeds only; others ignore it). */
  control(message: ControlMessage): void;
}
