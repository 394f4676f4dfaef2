import type { GazeHello, GazeSample } from '../gaze-sample';
import type { FeedHeader } from './feed-header';

/**
 * One decoded line of a gaze feed. Samples are already in screen pixels when the hello
 * declared screen_norm (raw and screen_px pass through). Garbage is counted and reported by
 * the receiver, never fatal. A hello also carries its header (the TSV layout it declares).
 */
export type FeedItem =
  | { readonly kind: 'hello'; readonly hello: GazeHello; readonly header: FeedHeader }
  | { readonly kind: 'sample'; readonly sample: GazeSample }
  | { readonly kind: 'garbage'; readonly reason: string };

export const garbage = (reason: string): FeedItem => ({ kind: 'garbage', reason });
