import type { LookName } from '../render/look-settings';
import type { PlacementMode } from '../geometry/placement';
import type { DisplayGeometry } from '../geometry/display-geometry';

export type FlashKind = 'general' | 'red';

/** Where a failure is: its bounding box on the screen in pixels and in degrees from the screen centre (x right, y down). */
export interface FlashRegion {
  readonly x_px: number;
  readonly y_px: number;
  readonly width_px: number;
  readonly height_px: number;
  readonly left_deg: number;
  readonly top_deg: number;
  readonly right_deg: number;
  readonly bottom_deg: number;
  /** Combined solid angle of the failing cells in the region. */
  readonly solid_angle_sr: number;
}

/** A time range (seconds of clip time from its first event) and region whose flashing is above the thresholds. */
export interface FlashFailure {
  readonly start_s: number;
  readonly end_s: number;
  readonly region: FlashRegion;
  /** Most flashes of one cell in one second of viewing (display time). */
  readonly flashes_per_s: number;
  readonly kind: FlashKind;
}

export interface FlashSettings {
  readonly look: LookName;
  readonly speed: number;
  readonly placement: PlacementMode;
  readonly display: DisplayGeometry;
  readonly rateHz: number;
}

export interface FlashAnalysis {
  readonly pass: boolean;
  readonly failures: FlashFailure[];
  readonly analysedWith: FlashSettings & { readonly analyserVersion: number; readonly frames: number; readonly cells: number; readonly cellSideDeg: number };
}

/** Raised when the method changes, so stored results are made again. */
export const FLASH_ANALYSER_VERSION = 1;
