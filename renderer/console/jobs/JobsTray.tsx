import { useState } from 'react';
import { useJobs } from './use-jobs';

/** Running and recent host work, in a corner of every screen. */
export function JobsTray() {
  const jobs = useJobs();
  const [dismissed, setDismissed] = useState<Set<string>>(new Set());
  const visible = jobs.filter((job) => job.state === 'running' || !dismissed.has(job.id)).slice(0, 5);
  if (visible.length === 0) return null;
  return (
    <aside className="jobs-tray" aria-label="Work in progress">
      {visible.map((job) => (
        <div key={job.id} className={`job job-${job.state}`} data-testid="job">
          <div className="job-head">
            <span>{job.label}</span>
            {job.state !== 'running' && (
              <button type="button" className="link" aria-label={`Dismiss ${job.label}`} onClick={() => setDismissed((d) => new Set(d).add(job.id))}>
                ×
              </button>
            )}
          </div>
          <progress max={1} value={job.progress} aria-label={`${job.label} progress`} />
          <div className="job-message" role={job.state === 'failed' ? 'alert' : undefined}>
            {job.message}
          </div>
        </div>
      ))}
    </aside>
  );
}
