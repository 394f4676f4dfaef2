import { useState } from 'react';
import type { CorrectionRecord } from '../../../app/core/study/records';
import { modelLabels } from './correction-choice';
import { formatDeg } from './quality-format';

const when = (iso: string) => iso.slice(0, 16).replace('T', ' ');

/** Whether a correction is on, with its provenance, and the corrections removed before. */
export function CorrectionStatus({ active, corrections, onRemove }: { active: CorrectionRecord | null; corrections: readonly CorrectionRecord[]; onRemove: ((record: CorrectionRecord) => Promise<void>) | null }) {
  const [confirming, setConfirming] = useState(false);
  const removed = corrections.filter((c) => c.removedAt !== null);
  return (
    <>
      {active ? (
        <div className="correction-on" data-testid="correction-state">
          <p>
            <strong>Correction on:</strong> {modelLabels[active.model]}, fitted on {active.fit.points} points of {active.fromValidationIds.length} checks, {when(active.createdAt)} by {active.createdBy}. Held-out error {formatDeg(active.fit.heldOutErrorBeforeDeg)} without, {formatDeg(active.fit.heldOutErrorAfterDeg)} with it. Analysis and release use the corrected gaze; the recorded gaze is kept as it was.
          </p>
          {onRemove &&
            (confirming ? (
              <span role="group" aria-label="Confirm the removal">
                <button
                  type="button"
                  className="danger"
                  onClick={() => {
                    setConfirming(false);
                    void onRemove(active);
                  }}
                >
                  Remove the correction
                </button>{' '}
                <button type="button" className="secondary" onClick={() => setConfirming(false)}>
                  Keep it
                </button>
              </span>
            ) : (
              <button type="button" className="secondary" onClick={() => setConfirming(true)}>
                Remove the correction…
              </button>
            ))}
        </div>
      ) : (
        <p data-testid="correction-state">Correction off: analysis and release use the gaze as recorded.</p>
      )}
      {removed.length > 0 && (
        <ul className="muted" aria-label="Removed corrections">
          {removed.map((c) => (
            <li key={c.id}>
              {modelLabels[c.model]}, applied {when(c.createdAt)} by {c.createdBy}, removed {when(c.removedAt!)}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
