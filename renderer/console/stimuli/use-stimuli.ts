import { useCallback, useEffect, useState } from 'react';
import type { Failure, StimulusMeta } from '../../../app/contract';
import { useHost } from '../host-context';

/** The library's list, refreshed whenever the host says stimuli changed. */
export function useStimuli(): { stimuli: StimulusMeta[] | null; failure: Failure | null; refresh: () => void } {
  const { api, connection } = useHost();
  const [stimuli, setStimuli] = useState<StimulusMeta[] | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const refresh = useCallback(() => {
    void api.listStimuli({}).then((result) => {
      if (result.ok) {
        setStimuli(result.value.stimuli);
        setFailure(null);
      } else setFailure(result);
    });
  }, [api]);
  useEffect(() => {
    if (connection === 'open') refresh();
  }, [connection, refresh]);
  useEffect(() => api.onStimuliChanged(refresh), [api, refresh]);
  return { stimuli, failure, refresh };
}
