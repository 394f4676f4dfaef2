import { useEffect, useState } from 'react';
import type { TableName } from '../../../app/core/study/records';
import type { LabStore } from '../../db/lab-store';
import { useLabState } from './lab-context';

/** Reads from the lab database, and reads again whenever one of `tables` changes. Null until the first read. */
export function useLabQuery<T>(tables: readonly TableName[], read: (store: LabStore) => Promise<T>, deps: readonly unknown[] = []): T | null {
  const { store } = useLabState();
  const [value, setValue] = useState<T | null>(null);
  useEffect(() => {
    if (!store) return;
    let live = true;
    const run = () => void read(store).then((next) => live && setValue(next));
    run();
    const unsubscribe = store.subscribe((changed) => {
      if (changed.some((name) => tables.includes(name))) run();
    });
    return () => {
      live = false;
      unsubscribe();
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [store, ...deps]);
  return value;
}
