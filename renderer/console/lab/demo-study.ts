import type { GazeloomApi } from '../../../app/contract';
import { LabImportError, type LabStore } from '../../db/lab-store';

export { DEMO_PASSPHRASE } from '../../../app/core/study/demo-passphrase';

/**
 * Loads the host's demo study into an empty lab database. 'building' means the host is
 * still making it (ask again later); a profile that holds anything is never touched.
 */
export async function loadDemoStudyIfEmpty(api: GazeloomApi, store: LabStore): Promise<'loaded' | 'building' | 'none'> {
  if (!(await store.isEmpty())) return 'none';
  const demo = await api.getDemoStudy({});
  if (!demo.ok) return 'none';
  if (demo.value.state === 'building') return 'building';
  if (demo.value.state !== 'ready' || !demo.value.tables) return 'none';
  try {
    await store.importTables(demo.value.tables);
  } catch (error) {
    // Another tab (or a set-up) got there first: the profile is no longer empty.
    if (error instanceof LabImportError && !(await store.isEmpty())) return 'none';
    throw error;
  }
  return 'loaded';
}
