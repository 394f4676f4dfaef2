/**
 * Colour of a region for the red flash test: its red ratio R / (R + G + B) and its CIE 1976
 * UCS chromaticity (u', v'), both from linear sRGB. XYZ from linear sRGB with the D65
 * matrix of IEC 61966-2-1; u' = 4X / (X + 15Y + 3Z), v' = 9Y / (X + 15Y + 3Z) (CIE 15:2004).
 * Black has no chromaticity: it gets the D65 white point and a red ratio of 0.
 */
export interface RegionColour {
  readonly redRatio: number;
  readonly u: number;
  readonly v: number;
}

/** D65 white in (u', v'). */
export const D65_UV = { u: 0.19784, v: 0.46832 } as const;

export function regionColour(r: number, g: number, b: number): RegionColour {
  const sum = r + g + b;
  if (!(sum > 1e-12)) return { redRatio: 0, ...D65_UV };
  const x = 0.4124 * r + 0.3576 * g + 0.1805 * b;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = 0.0193 * r + 0.1192 * g + 0.9505 * b;
  const d = x + 15 * y + 3 * z;
  return { redRatio: r / sum, u: (4 * x) / d, v: (9 * y) / d };
}
