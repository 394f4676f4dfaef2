/**
 * Statistics of one event stream, field for field what `gazeloom events stats --json` prints.
 * Policies for streams too short to have a rate:
 *   - no events: t_start_us and t_end_us are null, duration_s 0, mean_rate_hz null,
 *     peak_rate_hz 0, rate_series.rate_hz empty, hot_pixels.median_count null;
 *   - zero duration (one event, or all at one timestamp): mean_rate_hz is null, since
 *     count / 0 is no rate; peak_rate_hz and rate_series still come from the one 1 ms bin.
 * No field is ever NaN or Infinity.
 */
export interface EventStats {
  readonly count: number;
  /** First and last timestamps, absolute µs (null for an empty stream). */
  readonly t_start_us: number | null;
  readonly t_end_us: number | null;
  /** (t_end_us - t_start_us) / 1e6. */
  readonly duration_s: number;
  readonly width: number;
  readonly height: number;
  readonly on_count: number;
  readonly off_count: number;
  /** count / duration_s; null when duration_s is 0. */
  readonly mean_rate_hz: number | null;
  /** The most events in one 1 ms bin (bins start at t_start_us) times 1000. */
  readonly peak_rate_hz: number;
  readonly rate_series: RateSeries;
  readonly hot_pixels: HotPixels;
}

/**
 * Event rate over time for plotting. Bin j covers [t_start + j * bin_s, t_start + (j + 1) * bin_s)
 * and rate_hz[j] = (events in bin j) / bin_s. bin_s is 1, 2 or 5 times a power of ten
 * milliseconds, the smallest such that there are at most 1000 bins; the last bin is divided by
 * its full width even though the stream ends inside it, so sum(rate_hz) * bin_s = count.
 */
export interface RateSeries {
  readonly bin_s: number;
  readonly rate_hz: number[];
}

/**
 * Pixels whose event count exceeds threshold_factor times the median count of the pixels
 * that fired at least once (common practice, no source). The median of an even number of
 * counts is the mean of the two middle ones. Pixels are sorted by count, most first; equal
 * counts in row-major order (y, then x).
 */
export interface HotPixels {
  readonly threshold_factor: number;
  /** Null when no pixel fired. */
  readonly median_count: number | null;
  readonly pixels: HotPixel[];
}

export interface HotPixel {
  readonly x: number;
  readonly y: number;
  readonly count: number;
}
