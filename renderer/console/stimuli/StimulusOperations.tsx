import { useState } from 'react';
import type { EventStats, Failure, JobStatus, StimulusMeta, StimulusOperation } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { waitForJob } from '../jobs/use-jobs';

interface Props {
  readonly stimulus: StimulusMeta;
  readonly stats: EventStats | null;
  readonly onDerived: (id: string) => void;
}

/**
 * Trim, crop and filter. Each operation makes a new stimulus that names its parent; the
 * original is never changed.
 */
export function StimulusOperations({ stimulus, stats, onDerived }: Props) {
  const { api } = useHost();
  const [fromS, setFromS] = useState('0');
  const [toS, setToS] = useState(stimulus.durationS.toFixed(3));
  const [region, setRegion] = useState(`0,0,${stimulus.sensor.width},${stimulus.sensor.height}`);
  const [dtMs, setDtMs] = useState('10');
  const [job, setJob] = useState<JobStatus | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);

  const run = async (apply: StimulusOperation) => {
    const result = await api.operateOnStimulus({ id: stimulus.id, apply });
    if (!result.ok) return setFailure(result);
    setFailure(null);
    setJob({ id: result.value.jobId, kind: apply.operation, label: apply.operation, state: 'running', progress: 0, message: 'working', resultId: null });
    const finished = await waitForJob(api, result.value.jobId);
    setJob(finished);
    if (finished.state === 'done' && finished.resultId) onDerived(finished.resultId);
  };

  const seconds = (text: string) => Number(text.replace(',', '.'));
  const regionParts = region.split(',').map((v) => Number(v.trim()));
  return (
    <div className="operations" aria-label="Operations">
      <h3>Make a derived stimulus</h3>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          void run({ operation: 'trim', fromUs: stimulus.tStartUs + seconds(fromS) * 1e6, toUs: stimulus.tStartUs + seconds(toS) * 1e6 });
        }}
      >
        <label>
          Trim from <input aria-label="Trim from (s)" value={fromS} onChange={(e) => setFromS(e.target.value)} size={6} /> s
        </label>{' '}
        <label>
          to <input aria-label="Trim to (s)" value={toS} onChange={(e) => setToS(e.target.value)} size={6} /> s
        </label>{' '}
        <button type="submit">Trim</button>
      </form>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          const [x0 = 0, y0 = 0, width = 0, height = 0] = regionParts;
          void run({ operation: 'crop', x0, y0, width, height });
        }}
      >
        <label>
          Crop to x,y,width,height <input aria-label="Crop region" value={region} onChange={(e) => setRegion(e.target.value)} size={16} />
        </label>{' '}
        <button type="submit">Crop</button>
      </form>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          void run({ operation: 'background-activity', dtUs: Number(dtMs) * 1000 });
        }}
      >
        <label>
          Background-activity filter, neighbour within <input aria-label="Neighbour window (ms)" value={dtMs} onChange={(e) => setDtMs(e.target.value)} size={4} /> ms
        </label>{' '}
        <button type="submit">Filter</button>
      </form>
      <button type="button" disabled={!stats || stats.hot_pixels.pixels.length === 0} onClick={() => void run({ operation: 'remove-hot-pixels' })}>
        Remove {stats?.hot_pixels.pixels.length ?? 0} hot pixels
      </button>
      {failure && <FailureNote failure={failure} />}
      {job && (
        <p className={`job job-${job.state}`} role={job.state === 'failed' ? 'alert' : 'status'}>
          <progress max={1} value={job.progress} aria-label="Operation progress" /> {job.message}
        </p>
      )}
    </div>
  );
}
