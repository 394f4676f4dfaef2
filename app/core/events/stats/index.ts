export type { EventStats, HotPixel, HotPixels, RateSeries } from './event-stats';
export { EventStatsAccumulator } from './event-stats-accumulator';
export { findHotPixels, HOT_PIXEL_FACTOR, medianFiredCount } from './hot-pixels';
export { MAX_RATE_POINTS, rateBinWidthMs, rateSeriesFromMsBins } from './rate-series';
