export type Persistence = 'granted' | 'refused' | 'unsupported';

/**
 * Asks the browser not to evict the lab database under storage pressure
 * (navigator.storage.persist). Browsers may refuse; the lab archive backup is then the
 * safety net, and the console says so.
 */
export async function requestPersistentStorage(storage: Pick<StorageManager, 'persist' | 'persisted'> | undefined = globalThis.navigator?.storage): Promise<Persistence> {
  if (!storage || typeof storage.persist !== 'function') return 'unsupported';
  try {
    if (typeof storage.persisted === 'function' && (await storage.persisted())) return 'granted';
    return (await storage.persist()) ? 'granted' : 'refused';
  } catch {
    return 'refused';
  }
}
