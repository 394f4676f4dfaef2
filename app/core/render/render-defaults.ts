/**
 * The one place where the event renderer's defaults live. Every caller (stimulus preview,
 * stage, flash-hazard analysis) reads them from here, so the image a participant saw is
 * the image the analysis measures.
 */

/** sRGB, 0-255 per channel. */
export type Rgb = readonly [r: number, g: number, b: number];

/** The display rate assumed when a caller does not say (a common desktop monitor). */
export const DEFAULT_DISPLAY_RATE_HZ = 60;

/** One display frame at the default rate: the polarity look's window. */
export const DEFAULT_FRAME_INTERVAL_US = 1e6 / DEFAULT_DISPLAY_RATE_HZ;

/** Time constant of the decay look (time surfaces, Lagorce et al. 2017). */
export const DEFAULT_DECAY_TAU_US = 30_000;

/** Window of the grey accumulation look: about two frames at 60 Hz. */
export const DEFAULT_GREY_WINDOW_US = 33_000;

/**
 * Colours of the polarity and decay looks. Mid-grey background; ON is a warm amber that is
 * lighter than the background and OFF a mid blue that is darker, so luminance alone carries
 * the polarity in the same sense as the grey look (ON brightens, OFF darkens). That keeps
 * the polarity readable for viewers with red-green colour-vision deficiency, who still see
 * the blue-yellow axis, and for the flash-hazard analysis, which works on luminance.
 * Relative luminance (WCAG 2 formula on sRGB, IEC 61966-2-1): background 0.216, ON 0.556
 * (2.28:1 against the background), OFF 0.123 (1.54:1), ON against OFF 3.51:1.
 * The amber's red share R/(R+G+B) is 0.55, well below the 0.8 that flash guidelines
 * (WCAG 2 "general flash and red flash thresholds", value from memory) treat as saturated
 * red, so the palette itself never counts as red flashing.
 */
export const DEFAULT_BACKGROUND_RGB: Rgb = [128, 128, 128];
export const DEFAULT_ON_RGB: Rgb = [255, 184, 28];
export const DEFAULT_OFF_RGB: Rgb = [16, 96, 192];

/**
 * Grey accumulation: level = clamp(GREY_MID_LEVEL + GREY_GAIN_PER_EVENT * (nOn - nOff), 0, 255)
 * per pixel over the window. With 16 levels per event, a net 8 ON events reach white
 * (128 + 128 = 256, clamped to 255) and a net 8 OFF events reach black.
 */
export const GREY_MID_LEVEL = 128;
export const GREY_GAIN_PER_EVENT = 16;
