/**
 * Added to scene intensity before the logarithm, like a photodiode's dark current: it keeps
 * the log finite in black regions and makes the darkest parts less sensitive (common
 * practice, no source). Scene intensities run from about 10 to 300.
 */
export const DARK_INTENSITY = 1;

/** The log intensity a pixel model sees for a scene intensity. */
export const toLogIntensity = (intensity: number): number => Math.log(intensity + DARK_INTENSITY);
