import { useEffect, useState } from 'react';
import type { JobStatus } from '../../../app/contract';
import { useHost } from '../host-context';

/** Every host job this console has heard of, newest first, kept live from onJobProgress. */
export function useJobs(): JobStatus[] {
  const { api, connection } = useHost();
  const [jobs, setJobs] = useState<Map<string, JobStatus>>(new Map());
  useEffect(() => {
    if (connection !== 'open') return;
    void api.listJobs({}).then((result) => {
      if (result.ok) setJobs(new Map(result.value.jobs.map((job) => [job.id, job])));
    });
  }, [api, connection]);
  useEffect(() => api.onJobProgress((job) => setJobs((previous) => new Map(previous).set(job.id, job))), [api]);
  return [...jobs.values()].reverse();
}

/**
 * Resolves when the given job finishes (done or failed). It listens first and then asks
 * for the current list, so a job that finished before the listener existed is not missed.
 */
export function waitForJob(api: ReturnType<typeof useHost>['api'], jobId: string): Promise<JobStatus> {
  return new Promise((resolve) => {
    let settled = false;
    const finish = (job: JobStatus) => {
      if (settled || job.id !== jobId || job.state === 'running') return;
      settled = true;
      stop();
      resolve(job);
    };
    const stop = api.onJobProgress(finish);
    void api.listJobs({}).then((result) => result.ok && result.value.jobs.forEach(finish));
  });
}
