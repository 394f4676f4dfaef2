import { DEFAULT_DECAY_TAU_US, DEFAULT_FRAME_INTERVAL_US, DEFAULT_GREY_WINDOW_US } from './render-defaults';

export type LookName = 'polarity' | 'decay' | 'grey';

/**
 * How events become an image. Each look reads only its own fields:
 *   polarity  windowUs, else frameIntervalUs, else one frame at 60 Hz
 *   decay     tauUs, else 30 ms
 *   grey      windowUs, else 33 ms
 */
export interface LookSettings {
  readonly look: LookName;
  readonly tauUs?: number;
  readonly windowUs?: number;
  readonly frameIntervalUs?: number;
}

/** A look with its defaults filled in and its parameters checked. */
export type ResolvedLook =
  | { readonly look: 'polarity'; readonly windowUs: number }
  | { readonly look: 'decay'; readonly tauUs: number }
  | { readonly look: 'grey'; readonly windowUs: number };

function positive(name: string, value: number | undefined): number | undefined {
  if (value !== undefined && !(Number.isFinite(value) && value > 0)) {
    throw new RangeError(`${name} must be a positive finite number of microseconds, got ${value}`);
  }
  return value;
}

export function resolveLook(settings: LookSettings): ResolvedLook {
  const tauUs = positive('tauUs', settings.tauUs);
  const windowUs = positive('windowUs', settings.windowUs);
  const frameIntervalUs = positive('frameIntervalUs', settings.frameIntervalUs);
  switch (settings.look) {
    case 'polarity':
      return { look: 'polarity', windowUs: windowUs ?? frameIntervalUs ?? DEFAULT_FRAME_INTERVAL_US };
    case 'decay':
      return { look: 'decay', tauUs: tauUs ?? DEFAULT_DECAY_TAU_US };
    case 'grey':
      return { look: 'grey', windowUs: windowUs ?? DEFAULT_GREY_WINDOW_US };
    default:
      throw new RangeError(`look must be 'polarity', 'decay' or 'grey', got ${JSON.stringify(settings.look)}`);
  }
}
