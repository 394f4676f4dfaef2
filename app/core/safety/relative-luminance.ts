/**
 * Relative luminance as WCAG 2.2 defines it (W3C 2023, "relative luminance"): each sRGB
 * channel c in [0, 1] is linearised as c / 12.92 when c <= 0.04045, else
 * ((c + 0.055) / 1.055) ^ 2.4 (IEC 61966-2-1), and L = 0.2126 R + 0.7152 G + 0.0722 B.
 */
export function srgbToLinear(channel8: number): number {
  const c = channel8 / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Linear value of every 8-bit sRGB level, so a frame is linearised by table look-up. */
export const LINEAR_OF_SRGB8: Float64Array = Float64Array.from({ length: 256 }, (_, level) => srgbToLinear(level));

export const luminanceOfLinear = (r: number, g: number, b: number): number => 0.2126 * r + 0.7152 * g + 0.0722 * b;

export const relativeLuminance = (r8: number, g8: number, b8: number): number => luminanceOfLinear(LINEAR_OF_SRGB8[r8]!, LINEAR_OF_SRGB8[g8]!, LINEAR_OF_SRGB8[b8]!);
