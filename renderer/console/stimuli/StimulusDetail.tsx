import { useEffect, useState } from 'react';
import type { EventStats, Failure, StimulusMeta } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { LinePlot } from '../plots/LinePlot';
import { EditStimulus } from './EditStimulus';
import { FlashResult } from './FlashResult';
import { RemoveStimulus } from './RemoveStimulus';
import { StimulusFacts } from './StimulusFacts';
import { StimulusOperations } from './StimulusOperations';
import { StimulusPreview } from './StimulusPreview';

interface Props {
  readonly stimulus: StimulusMeta;
  readonly onDerived: (id: string) => void;
  readonly onRemoved: (removed: StimulusMeta) => void;
}

export function StimulusDetail({ stimulus, onDerived, onRemoved }: Props) {
  const { api } = useHost();
  const [stats, setStats] = useState<EventStats | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const [timeUs, setTimeUs] = useState(stimulus.tStartUs);

  useEffect(() => {
    void api.getStimulusStats({ id: stimulus.id }).then((result) => (result.ok ? setStats(result.value) : setFailure(result)));
  }, [api, stimulus.id]);

  const rate = stats?.rate_series;
  const xs = rate ? rate.rate_hz.map((_, i) => (i + 0.5) * rate.bin_s) : [];
  return (
    <section className="stimulus-detail panel" aria-labelledby="detail-heading">
      <div className="panel-head">
        <h2 id="detail-heading">{stimulus.name}</h2>
        {stimulus.mayFlash && <span className="badge badge-warn">{stimulus.flash ? 'fails the flash screening' : 'not yet screened for flashing'}: show only to participants cleared for photosensitivity</span>}
      </div>
      {failure && <FailureNote failure={failure} />}
      <StimulusFacts stimulus={stimulus} stats={stats} />
      {rate && (
        <LinePlot
          title="Event rate over time"
          xLabel="time (s)"
          yLabel="events/s"
          series={[{ label: 'event rate', xs, ys: rate.rate_hz, colour: '#2f6f62' }]}
          cursorX={(timeUs - stimulus.tStartUs) / 1e6}
          onPick={(seconds) => setTimeUs(stimulus.tStartUs + Math.max(0, seconds) * 1e6)}
        />
      )}
      <StimulusPreview stimulus={stimulus} timeUs={timeUs} onTime={setTimeUs} />
      <FlashResult stimulus={stimulus} cursorS={(timeUs - stimulus.tStartUs) / 1e6} onPick={(seconds) => setTimeUs(stimulus.tStartUs + Math.max(0, seconds) * 1e6)} />
      <div className="detail-columns">
        <EditStimulus stimulus={stimulus} />
        <StimulusOperations stimulus={stimulus} stats={stats} onDerived={onDerived} />
      </div>
      <RemoveStimulus stimulus={stimulus} onRemoved={onRemoved} />
    </section>
  );
}
