/**
 * The aisle as seen by the fixed camera, in fractions of the sensor's width (u) and height
 * (v), so any sensor size gets the same picture. The camera looks across the aisle at a
 * rack of shelving; a conveyor runs along the rack's foot, a walkway lies in front of it,
 * and three forklift lanes come nearer the camera, each lower in the image and larger.
 */
export const AISLE = {
  ceilingBottomV: 0.09,
  lampU: [0.2, 0.5, 0.8],
  lampV: 0.04,
  uprightU: [0.03, 0.22, 0.41, 0.6, 0.79, 0.98],
  uprightHalfWidthU: 0.009,
  /** Tops of the rack's beams; boxes stand on all but the first. */
  beamV: [0.1, 0.235, 0.37, 0.505],
  beamHalfHeightV: 0.007,
  floorV: 0.56,
  beltTopV: 0.535,
  beltBottomV: 0.548,
  railBottomV: 0.575,
  conveyorLegBottomV: 0.6,
  walkwayLineV: [0.605, 0.665],
  beaconU: 0.7,
  /** A failing tube between the first two lamps. */
  flickeringLightU: 0.35,
} as const;

/** Ground line (v) and size scale of each depth where things move; scale 1 is the nearest lane. */
export const DEPTHS = {
  conveyor: { groundV: AISLE.beltTopV, scale: 0.6 },
  walkway: { groundV: 0.635, scale: 0.62 },
  farLane: { groundV: 0.71, scale: 0.66 },
  midLane: { groundV: 0.83, scale: 0.8 },
  nearLane: { groundV: 0.975, scale: 1 },
} as const;

/** Object sizes are drawn in pixels of a 480-row sensor and scaled by the sensor's height. */
export const REFERENCE_HEIGHT_PX = 480;
