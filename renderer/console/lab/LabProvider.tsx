import { useCallback, useEffect, useMemo, useState, type ReactNode } from 'react';
import type { DataKey } from '../../../app/core/crypto';
import type { KeyringRecord } from '../../../app/core/study/records';
import { LabDatabase } from '../../db/lab-database';
import { LabStore } from '../../db/lab-store';
import { requestPersistentStorage, type Persistence } from '../../db/persistent-storage';
import { useHost } from '../host-context';
import { loadDemoStudyIfEmpty } from './demo-study';
import { LabContext, type LabPhase } from './lab-context';
import { chosenStudyId, lastOperatorId, lockAfterMinutes as savedLockAfterMinutes, saveChosenStudyId, saveLastOperatorId, saveLockAfterMinutes } from './lab-preferences';
import { LockScreen } from './LockScreen';
import './lab.css';
import { useInactivityLock } from './use-inactivity-lock';

let sharedStore: LabStore | null = null;
/** One database connection per page, kept across React re-mounts. */
const labStore = (): LabStore => (sharedStore ??= new LabStore(new LabDatabase()));

/**
 * Opens the lab database and keeps the lab's key in memory only while unlocked. Locked, an
 * overlay covers the whole console (screens stay mounted underneath, so a running session
 * goes on) and every screen drops the personal text it had decrypted.
 */
export function LabProvider({ children }: { children: ReactNode }) {
  const { api, connection } = useHost();
  const store = useMemo(labStore, []);
  const [keyring, setKeyring] = useState<KeyringRecord | null | undefined>(undefined);
  const [dataKey, setDataKey] = useState<DataKey | null>(null);
  const [operatorId, setOperatorId] = useState<string | null>(null);
  const [studyId, setStudyIdState] = useState<string | null>(chosenStudyId);
  const [persistence, setPersistence] = useState<Persistence | 'pending'>('pending');
  const [demoBuilding, setDemoBuilding] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [demoFailure, setDemoFailure] = useState<string | null>(null);
  const [lockAfterMinutes, setLockAfter] = useState(savedLockAfterMinutes);

  const reload = useCallback(
    async (key?: DataKey, operator?: string) => {
      const next = await store.keyring();
      setKeyring(next ?? null);
      if (key) setDataKey(key);
      if (operator) {
        saveLastOperatorId(operator);
        setOperatorId(operator);
      }
    },
    [store],
  );

  useEffect(() => {
    reload().catch((error: unknown) => setFailure(`The lab database could not be opened: ${(error as Error).message}`));
    const onVersionChange = () => setFailure('The lab database was upgraded in another window. Reload this page to go on.');
    store.db.on('versionchange', onVersionChange);
    return () => store.db.on('versionchange').unsubscribe(onVersionChange);
  }, [store, reload]);

  const chooseStudy = useCallback((id: string | null) => {
    saveChosenStudyId(id);
    setStudyIdState(id);
  }, []);

  useEffect(() => {
    void requestPersistentStorage().then(setPersistence);
  }, []);

  // A new profile gets the demo study the host made, once it is ready, unless a lab was set up meanwhile.
  useEffect(() => {
    if (keyring !== null || connection !== 'open') return;
    let live = true;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const look = async () => {
      const outcome = await loadDemoStudyIfEmpty(api, store).catch((error: unknown) => {
        setDemoFailure(`The demo study could not be loaded: ${(error as Error).message}`);
        return 'none' as const;
      });
      if (live) setDemoBuilding(outcome === 'building');
      if (outcome === 'loaded') {
        const demoStudy = (await store.list('studies')).find((study) => study.demo);
        if (demoStudy) chooseStudy(demoStudy.id);
      }
      if (outcome !== 'building') return reload();
      if (live) timer = setTimeout(() => void look(), 3000);
    };
    void look();
    return () => {
      live = false;
      clearTimeout(timer);
    };
  }, [api, connection, keyring, store, reload, chooseStudy]);

  const lock = useCallback(() => setDataKey(null), []);
  const hasKey = dataKey !== null;
  useInactivityLock(hasKey, lockAfterMinutes, lock);

  const phase: LabPhase = failure ? 'failed' : keyring === undefined ? 'opening' : keyring === null ? 'setup' : !dataKey ? 'locked' : !operatorId ? 'choose-operator' : 'open';
  const value = {
    phase,
    store,
    keyring: keyring ?? null,
    dataKey,
    operator: operatorId && dataKey ? { id: operatorId } : null,
    studyId,
    persistence,
    demoBuilding,
    demoFailure,
    failure,
    lockAfterMinutes,
    setStudyId: chooseStudy,
    lock,
    unlocked: (key: DataKey) => {
      setDataKey(key);
      setOperatorId(null);
    },
    chooseOperator: (id: string) => {
      saveLastOperatorId(id);
      setOperatorId(id);
    },
    reload,
    setLockAfterMinutes: (minutes: number) => {
      saveLockAfterMinutes(minutes);
      setLockAfter(minutes);
    },
  };
  const covered = phase === 'locked' || phase === 'choose-operator';
  return (
    <LabContext.Provider value={value}>
      <div className="lab-frame" inert={covered} aria-hidden={covered || undefined}>
        {children}
      </div>
      {covered && <LockScreen preselectOperatorId={lastOperatorId()} />}
    </LabContext.Provider>
  );
}
