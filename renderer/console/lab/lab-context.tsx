import { createContext, useContext } from 'react';
import type { DataKey } from '../../../app/core/crypto';
import type { KeyringRecord } from '../../../app/core/study/records';
import type { LabStore } from '../../db/lab-store';
import type { Persistence } from '../../db/persistent-storage';

/**
 * Where the lab stands: the database opening, no lab yet (set-up), locked (the key is not
 * in memory), unlocked but no operator chosen, or open.
 */
export type LabPhase = 'opening' | 'failed' | 'setup' | 'locked' | 'choose-operator' | 'open';

export interface LabState {
  readonly phase: LabPhase;
  readonly store: LabStore | null;
  readonly keyring: KeyringRecord | null;
  readonly dataKey: DataKey | null;
  readonly operator: { id: string } | null;
  readonly studyId: string | null;
  readonly persistence: Persistence | 'pending';
  /** The host is still making the demo study; it is loaded when ready if the lab is still empty. */
  readonly demoBuilding: boolean;
  readonly demoFailure: string | null;
  readonly failure: string | null;
  readonly lockAfterMinutes: number;
}

export interface LabActions {
  setStudyId(id: string | null): void;
  lock(): void;
  unlocked(dataKey: DataKey): void;
  chooseOperator(id: string): void;
  /** Re-reads the keyring (after set-up, a passphrase change or a restore). */
  reload(dataKey?: DataKey, operatorId?: string): Promise<void>;
  setLockAfterMinutes(minutes: number): void;
}

export const LabContext = createContext<(LabState & LabActions) | null>(null);

/** The lab's state anywhere under <LabProvider>, whatever the phase. */
export function useLabState(): LabState & LabActions {
  const value = useContext(LabContext);
  if (!value) throw new Error('useLabState must be used inside <LabProvider>');
  return value;
}

export interface Lab {
  readonly store: LabStore;
  readonly keyring: KeyringRecord;
  /** Null while locked: personal fields cannot be read, and screens show none. */
  readonly dataKey: DataKey | null;
  readonly operator: { id: string } | null;
  readonly studyId: string | null;
  setStudyId(id: string | null): void;
  lock(): void;
  readonly persistence: Persistence | 'pending';
  readonly demo: boolean;
}

/** The lab for screens inside <LabGate> (set up, locked or open). */
export function useLab(): Lab {
  const s = useLabState();
  if (!s.store || !s.keyring) throw new Error('useLab must be used inside <LabGate> (the lab is not set up yet)');
  return { store: s.store, keyring: s.keyring, dataKey: s.dataKey, operator: s.operator, studyId: s.studyId, setStudyId: s.setStudyId, lock: s.lock, persistence: s.persistence, demo: s.keyring.demo };
}

export { LabProvider } from './LabProvider';
