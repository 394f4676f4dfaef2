import { useEffect, useState } from 'react';
import type { DataKey } from '../../../app/core/crypto';
import { useLabState } from './lab-context';

/**
 * Personal text decrypted for display: `open` runs with the lab's key while unlocked, and
 * its value is dropped the moment the lab locks. A field that cannot be opened is a
 * failure to show, not a crash.
 */
export function useOpened<T>(open: (key: DataKey) => Promise<T>, deps: readonly unknown[]): { value: T | null; failure: string | null } {
  const { dataKey } = useLabState();
  const [state, setState] = useState<{ value: T | null; failure: string | null }>({ value: null, failure: null });
  useEffect(() => {
    setState({ value: null, failure: null });
    if (!dataKey) return;
    let live = true;
    open(dataKey).then(
      (value) => live && setState({ value, failure: null }),
      (error: unknown) => live && setState({ value: null, failure: `A personal field could not be decrypted: ${(error as Error).message}` }),
    );
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [dataKey, ...deps]);
  return state;
}
