import { z } from 'zod';

/** Long work in the host (imports, conversions, demo clips): one status per job, sent as it moves. */
export const jobStatus = z.object({
  id: z.string(),
  kind: z.string(),
  label: z.string(),
  state: z.enum(['running', 'done', 'failed']),
  progress: z.number().min(0).max(1),
  message: z.string(),
  /** What the job made, e.g. the new stimulus's id; null while running or on failure. */
  resultId: z.string().nullable(),
});

export const jobStarted = z.object({ jobId: z.string() });

export type JobStatus = z.infer<typeof jobStatus>;
