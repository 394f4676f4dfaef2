import type { EventStats, StimulusMeta } from '../../../app/contract';
import { formatCount, formatDuration, formatRate } from '../format';

function describeSource(source: StimulusMeta['source']): string {
  switch (source.kind) {
    case 'import':
      return `imported from ${source.file}`;
    case 'simulation':
      return `simulated ${source.scene} scene (${source.objects.join(', ')}), seed ${source.seed}`;
    case 'operation':
      return `${source.operation} of ${source.parentId}`;
  }
}

export function StimulusFacts({ stimulus, stats }: { stimulus: StimulusMeta; stats: EventStats | null }) {
  return (
    <dl className="facts">
      <dt>Source</dt>
      <dd>{describeSource(stimulus.source)}</dd>
      <dt>Duration</dt>
      <dd>{formatDuration(stimulus.durationS)}</dd>
      <dt>Events</dt>
      <dd>
        {formatCount(stimulus.eventCount)}
        {stats && ` (${formatCount(stats.on_count)} ON, ${formatCount(stats.off_count)} OFF)`}
      </dd>
      <dt>Sensor</dt>
      <dd>
        {stimulus.sensor.width}×{stimulus.sensor.height} px, time resolution {stimulus.resolution === 'ns' ? 'ns' : 'µs'}
      </dd>
      {stats && (
        <>
          <dt>Event rate</dt>
          <dd>
            {stats.mean_rate_hz === null ? 'all events at one instant' : `mean ${formatRate(stats.mean_rate_hz)}`}, peak {formatRate(stats.peak_rate_hz)} (1 ms bins)
          </dd>
          <dt>Hot pixels</dt>
          <dd>
            {stats.hot_pixels.pixels.length === 0
              ? 'none'
              : `${stats.hot_pixels.pixels.length} (more than ${stats.hot_pixels.threshold_factor}× the median of ${stats.hot_pixels.median_count} events per firing pixel)`}
          </dd>
        </>
      )}
      {stimulus.warnings.length > 0 && (
        <>
          <dt>Warnings</dt>
          <dd className="warning">{stimulus.warnings.join('; ')}</dd>
        </>
      )}
    </dl>
  );
}
