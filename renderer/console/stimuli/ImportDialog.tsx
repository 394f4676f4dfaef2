import { useEffect, useRef, useState } from 'react';
import type { Failure, JobStatus } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';
import { waitForJob } from '../jobs/use-jobs';
import { FileBrowser } from './FileBrowser';

interface Props {
  readonly onClose: () => void;
  readonly onImported: (stimulusId: string) => void;
}

type TimeUnit = 'us' | 'ns' | 'ms' | 's';

/**
 * Import a recording that lies on the host machine: choose it in the host's folders, say
 * what the file does not (time unit, sensor size), and watch the import's progress. A file
 * that fails leaves the library unchanged and the message says where and why.
 */
export function ImportDialog({ onClose, onImported }: Props) {
  const { api } = useHost();
  const dialog = useRef<HTMLDialogElement>(null);
  const [path, setPath] = useState<string | null>(null);
  const [name, setName] = useState('');
  const [timeUnit, setTimeUnit] = useState<TimeUnit | ''>('');
  const [width, setWidth] = useState('');
  const [height, setHeight] = useState('');
  const [sort, setSort] = useState(false);
  const [job, setJob] = useState<JobStatus | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);

  useEffect(() => {
    dialog.current?.showModal();
  }, []);
  useEffect(() => (job ? api.onJobProgress((next) => next.id === job.id && setJob(next)) : undefined), [api, job?.id]);

  const start = async () => {
    if (!path) return;
    const w = Number(width);
    const h = Number(height);
    const sensor = width || height ? { width: w, height: h } : undefined;
    const result = await api.importStimulus({ path, ...(name ? { name } : {}), ...(timeUnit ? { timeUnit } : {}), ...(sensor ? { sensor } : {}), sort });
    if (!result.ok) return setFailure(result);
    setFailure(null);
    setJob({ id: result.value.jobId, kind: 'import', label: 'Import', state: 'running', progress: 0, message: 'starting', resultId: null });
    const finished = await waitForJob(api, result.value.jobId);
    setJob(finished);
    if (finished.state === 'done' && finished.resultId) onImported(finished.resultId);
  };

  const running = job?.state === 'running';
  return (
    <dialog ref={dialog} className="import-dialog" aria-labelledby="import-heading" onClose={onClose}>
      <h2 id="import-heading">Import a recording</h2>
      <FileBrowser chosen={path} onChoose={setPath} />
      <div className="import-options">
        <p>
          Chosen: <span className="path">{path ?? 'nothing yet'}</span>
        </p>
        <label className="field">
          Name in the library
          <input value={name} onChange={(e) => setName(e.target.value)} placeholder="the file's name" />
        </label>
        <label className="field">
          Time unit of t
          <select value={timeUnit} onChange={(e) => setTimeUnit(e.target.value as TimeUnit | '')}>
            <option value="">from the file (CSV: µs, headerless: s)</option>
            <option value="us">microseconds</option>
            <option value="ns">nanoseconds</option>
            <option value="ms">milliseconds</option>
            <option value="s">seconds</option>
          </select>
        </label>
        <fieldset className="sensor-size">
          <legend>Sensor size (if the file does not say)</legend>
          <input aria-label="Sensor width" inputMode="numeric" value={width} onChange={(e) => setWidth(e.target.value)} placeholder="width" />
          ×
          <input aria-label="Sensor height" inputMode="numeric" value={height} onChange={(e) => setHeight(e.target.value)} placeholder="height" />
        </fieldset>
        <label className="check">
          <input type="checkbox" checked={sort} onChange={(e) => setSort(e.target.checked)} /> Sort events by time (for files whose timestamps go backwards)
        </label>
      </div>
      {failure && <FailureNote failure={failure} />}
      {job && (
        <div className={`job job-${job.state}`} role={job.state === 'failed' ? 'alert' : 'status'}>
          <progress max={1} value={job.progress} aria-label="Import progress" /> {job.message}
        </div>
      )}
      <div className="dialog-buttons">
        <button type="button" onClick={() => void start()} disabled={!path || running}>
          Import
        </button>
        <button type="button" className="secondary" onClick={() => dialog.current?.close()}>
          {job?.state === 'done' ? 'Close' : 'Cancel'}
        </button>
      </div>
    </dialog>
  );
}
