import { useEffect, useState } from 'react';
import type { StageStatusEvent } from '../../app/contract';
import { useHost } from './host-context';

/** The stage page's latest status: asked for once, then kept up to date by onStageStatus. */
export function useStageStatus(): StageStatusEvent | null {
  const { api, connection } = useHost();
  const [status, setStatus] = useState<StageStatusEvent | null>(null);
  useEffect(() => {
    if (connection === 'open') void api.getStageStatus({}).then((r) => r.ok && setStatus(r.value.stage));
  }, [api, connection]);
  useEffect(() => api.onStageStatus(setStatus), [api]);
  return status;
}
