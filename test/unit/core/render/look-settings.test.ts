import { describe, expect, it } from 'vitest';
import { resolveLook, type LookSettings } from '../../../../app/core/render/look-settings';
import * as defaults from '../../../../app/core/render/render-defaults';

// The defaults the issue asks for (common practice, no source), pinned so a change shows in review.
describe('render defaults and look settings', () => {
  it('defines the defaults once', () => {
    expect({ ...defaults }).toEqual({
      DEFAULT_DISPLAY_RATE_HZ: 60,
      DEFAULT_FRAME_INTERVAL_US: 1e6 / 60,
      DEFAULT_DECAY_TAU_US: 30_000,
      DEFAULT_GREY_WINDOW_US: 33_000,
      DEFAULT_BACKGROUND_RGB: [128, 128, 128],
      DEFAULT_ON_RGB: [255, 184, 28],
      DEFAULT_OFF_RGB: [16, 96, 192],
      GREY_MID_LEVEL: 128,
      GREY_GAIN_PER_EVENT: 16,
    });
  });

  it('fills each look’s own parameters from the defaults', () => {
    expect(resolveLook({ look: 'polarity' })).toEqual({ look: 'polarity', windowUs: 1e6 / 60 });
    expect(resolveLook({ look: 'polarity', frameIntervalUs: 8000 })).toEqual({ look: 'polarity', windowUs: 8000 });
    expect(resolveLook({ look: 'polarity', frameIntervalUs: 8000, windowUs: 4000, tauUs: 9 })).toEqual({ look: 'polarity', windowUs: 4000 });
    expect(resolveLook({ look: 'decay' })).toEqual({ look: 'decay', tauUs: 30_000 });
    expect(resolveLook({ look: 'decay', tauUs: 50_000, windowUs: 1 })).toEqual({ look: 'decay', tauUs: 50_000 });
    expect(resolveLook({ look: 'grey' })).toEqual({ look: 'grey', windowUs: 33_000 });
    expect(resolveLook({ look: 'grey', windowUs: 10_000, frameIntervalUs: 8000 })).toEqual({ look: 'grey', windowUs: 10_000 });
  });

  it('rejects parameters that are not positive finite microseconds, and unknown looks', () => {
    expect(() => resolveLook({ look: 'decay', tauUs: -1 })).toThrow(new RangeError('tauUs must be a positive finite number of microseconds, got -1'));
    expect(() => resolveLook({ look: 'grey', windowUs: Number.NaN })).toThrow(/windowUs/);
    expect(() => resolveLook({ look: 'polarity', frameIntervalUs: Infinity })).toThrow(/frameIntervalUs/);
    // A field the look does not read is still checked, so a typo in a study's settings is caught.
    expect(() => resolveLook({ look: 'grey', tauUs: 0 })).toThrow(/tauUs/);
    expect(() => resolveLook({ look: 'sepia' } as unknown as LookSettings)).toThrow(/look must be 'polarity', 'decay' or 'grey', got "sepia"/);
  });
});
