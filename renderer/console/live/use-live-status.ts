import { useEffect, useState } from 'react';
import type { LiveStatus } from '../../../app/contract';
import { useHost } from '../host-context';

/** The host's live monitoring figures, pushed a few times a second. */
export function useLiveStatus(): LiveStatus | null {
  const { api, connection } = useHost();
  const [status, setStatus] = useState<LiveStatus | null>(null);
  useEffect(() => {
    if (connection === 'open') void api.getLiveStatus({}).then((r) => r.ok && setStatus(r.value));
  }, [api, connection]);
  useEffect(() => api.onLiveStatus(setStatus), [api]);
  return status;
}
