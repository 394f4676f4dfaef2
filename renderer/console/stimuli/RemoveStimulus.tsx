import { useState } from 'react';
import type { Failure, StimulusMeta } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';

/** Removal asks first and can be undone: the host keeps removed stimuli in the library trash. */
export function RemoveStimulus({ stimulus, onRemoved }: { stimulus: StimulusMeta; onRemoved: (removed: StimulusMeta) => void }) {
  const { api } = useHost();
  const [confirming, setConfirming] = useState(false);
  const [failure, setFailure] = useState<Failure | null>(null);
  if (!confirming) {
    return (
      <button type="button" className="secondary danger" onClick={() => setConfirming(true)}>
        Remove from library…
      </button>
    );
  }
  return (
    <div className="confirm" role="alertdialog" aria-label="Confirm removal">
      <p>
        Remove “{stimulus.name}”? It moves to the library trash; protocols that use it will no longer find it.
      </p>
      <button
        type="button"
        className="danger"
        onClick={async () => {
          const result = await api.removeStimulus({ id: stimulus.id });
          if (!result.ok) return setFailure(result);
          setConfirming(false);
          onRemoved(stimulus);
        }}
      >
        Remove
      </button>
      <button type="button" className="secondary" onClick={() => setConfirming(false)}>
        Keep it
      </button>
      {failure && <FailureNote failure={failure} />}
    </div>
  );
}
