export { BackgroundActivityFilter, DEFAULT_BACKGROUND_ACTIVITY_DT_US, type BackgroundActivityOptions } from './background-activity-filter';
export { HotPixelRemoval, type PixelAddress } from './hot-pixel-removal';
export { RegionCrop, type SensorRegion } from './region-crop';
export { checkEventsInSensor, validateSensorSize } from './sensor-bounds';
export { sortByTime } from './sort-by-time';
export { trimToTimeRange } from './trim-time-range';
