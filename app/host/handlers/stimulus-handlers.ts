import { homedir } from 'node:os';
import type { GazeloomHandlers } from '../../contract';
import { fail } from '../../contract/result';
import { listDirectory } from '../file-browser';
import type { JobRunner } from '../jobs';
import type { StimulusService } from '../stimuli/stimulus-service';
import type { StimulusStore } from '../stimuli/stimulus-store';

type StimulusChannels =
  | 'listJobs'
  | 'listDirectory'
  | 'listStimuli'
  | 'getStimulusStats'
  | 'importStimulus'
  | 'operateOnStimulus'
  | 'updateStimulus'
  | 'removeStimulus'
  | 'restoreStimulus'
  | 'readStimulusEvents';

interface Deps {
  readonly store: StimulusStore;
  readonly service: StimulusService;
  readonly jobs: JobRunner;
  readonly changed: (ids: string[]) => void;
}

/** The stimulus library's channels: the store answers reads, the service runs jobs. */
export function stimulusHandlers({ store, service, jobs, changed }: Deps): Pick<GazeloomHandlers, StimulusChannels> {
  const missing = (id: string) => fail('not_found', `no stimulus "${id}" in the library`);
  return {
    listJobs: () => ({ jobs: jobs.list() }),
    listDirectory: ({ path }) =>
      listDirectory(path, [
        { label: 'Home', path: homedir() },
        { label: 'Stimulus library', path: store.root },
      ]),
    listStimuli: async () => ({ stimuli: await store.list() }),
    getStimulusStats: async ({ id }) => (await store.stats(id)) ?? missing(id),
    importStimulus: (request) => ({ jobId: service.startImport(request) }),
    operateOnStimulus: async (request) => {
      if (!(await store.get(request.id))) return missing(request.id);
      return { jobId: service.startOperation(request) };
    },
    updateStimulus: async ({ id, ...patch }) => {
      const meta = await store.get(id);
      if (!meta) return missing(id);
      const next = { ...meta, ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)) };
      await store.writeMeta(next);
      changed([id]);
      return next;
    },
    removeStimulus: async ({ id }) => {
      if (!(await store.get(id))) return missing(id);
      await service.forget(id);
      await store.remove(id);
      changed([id]);
      return {};
    },
    restoreStimulus: async ({ id }) => {
      if (!(await store.restore(id))) return fail('not_found', `"${id}" is not in the library trash`);
      changed([id]);
      return (await store.get(id)) ?? missing(id);
    },
    readStimulusEvents: async (request) => (await service.readWindow(request)) ?? missing(request.id),
  };
}
