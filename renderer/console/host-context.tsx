import { createContext, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import type { GazeloomApi, Result } from '../../app/contract';
import { connectToHost } from '../shared/host-api';
import type { ConnectionState } from '../shared/ws-transport';

interface HostContextValue {
  readonly api: GazeloomApi;
  readonly connection: ConnectionState;
}

const HostContext = createContext<HostContextValue | null>(null);

let sharedApi: GazeloomApi | null = null;
const stateListeners = new Set<(state: ConnectionState) => void>();
let lastState: ConnectionState = 'connecting';

/** One connection per page, made on first use and kept across React re-mounts. */
function hostApi(): GazeloomApi {
  sharedApi ??= connectToHost('console', (state) => {
    lastState = state;
    for (const listener of stateListeners) listener(state);
  });
  return sharedApi;
}

export function HostProvider({ children }: { children: ReactNode }) {
  const api = useMemo(hostApi, []);
  const [connection, setConnection] = useState<ConnectionState>(lastState);
  useEffect(() => {
    stateListeners.add(setConnection);
    setConnection(lastState);
    return () => {
      stateListeners.delete(setConnection);
    };
  }, []);
  return <HostContext.Provider value={{ api, connection }}>{children}</HostContext.Provider>;
}

export function useHost(): HostContextValue {
  const value = useContext(HostContext);
  if (!value) throw new Error('useHost must be used inside <HostProvider>');
  return value;
}

/** Calls a host channel once on mount (and again when `deps` change); failures are kept, not thrown. */
export function useHostQuery<T>(call: (api: GazeloomApi) => Promise<Result<T>>, deps: readonly unknown[] = []): Result<T> | null {
  const { api, connection } = useHost();
  const [result, setResult] = useState<Result<T> | null>(null);
  useEffect(() => {
    let live = true;
    if (connection === 'open') void call(api).then((next) => live && setResult(next));
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [api, connection, ...deps]);
  return result;
}
