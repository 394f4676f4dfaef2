/**
 * The numbers of the flash screening, each from its definition in W3C (2023), "Web Content
 * Accessibility Guidelines (WCAG) 2.2", success criterion 2.3.1 "Three Flashes or Below
 * Threshold" and its glossary entry "general flash and red flash thresholds". WCAG adapted
 * them for desktop viewing from the broadcast guidance of ITU-R BT.1702 (2005), "Guidance
 * for the reduction of photosensitive epileptic seizures caused by television", which
 * states the same limits in cd/m² of a calibrated television.
 */

/** More than this many flashes in any one-second period can fail. */
export const MAX_FLASHES_PER_WINDOW = 3;
export const FLASH_WINDOW_S = 1;

/** A general flash: opposing changes of at least 10 % of the maximum relative luminance (1.0)... */
export const GENERAL_MIN_CHANGE = 0.1;
/** ...where the darker state's relative luminance is below 0.80. */
export const GENERAL_DARKER_BELOW = 0.8;

/** A saturated red state: R / (R + G + B) of at least 0.8. */
export const RED_MIN_RATIO = 0.8;
/** A red transition: its states differ by more than 0.2 in the CIE 1976 UCS (u', v') diagram. */
export const RED_MIN_CHROMA_CHANGE = 0.2;
/**
 * How far the red ratio must turn back before a red peak or trough counts as one (our
 * choice, mirroring the 10 % of the general flash; common practice, no source). It only
 * decides where states are read; the two conditions above decide whether a transition counts.
 */
export const RED_RATIO_SWING = 0.1;

/** Flashes pass when their combined area is at most 0.006 sr within any 10-degree visual field. */
export const FLASH_AREA_LIMIT_SR = 0.006;
export const VISUAL_FIELD_DIAMETER_DEG = 10;

/**
 * Side of the screening cells, about 1 degree: fine enough that 0.006 sr (a 4.4-degree
 * square) spans some 20 cells, coarse enough that a fine balanced pattern (WCAG's exception
 * for squares under 0.1 degree, and the single-pixel events of an event camera) averages out.
 */
export const CELL_SIDE_DEG = 1;
