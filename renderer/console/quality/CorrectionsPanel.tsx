import { useMemo, useState } from 'react';
import { activeCorrection, buildCorrection, removedCorrection } from '../../../app/core/quality/correction';
import { correctionModels, type CorrectionModel, type CorrectionRecord, type SessionRecord, type ValidationRecord } from '../../../app/core/study/records';
import { useLab } from '../lab/lab-context';
import { checksFor, defaultUses, modelLabels, type CheckUse } from './correction-choice';
import { CorrectionStatus } from './CorrectionStatus';
import { formatDeg } from './quality-format';

const useLabels: Record<CheckUse, string> = { fit: 'fit on', held_out: 'hold out', unused: 'not used' };

/**
 * A per-session correction fitted on chosen validations and drift checks and judged on the
 * held-out ones. Applying stores it (switched on) with its provenance; removing switches it
 * off and keeps the record. The recorded gaze never changes either way.
 */
export function CorrectionsPanel({ session, checks, corrections, timeOf }: { session: SessionRecord; checks: readonly ValidationRecord[]; corrections: readonly CorrectionRecord[]; timeOf: (v: ValidationRecord) => string }) {
  const { store, operator } = useLab();
  const [model, setModel] = useState<CorrectionModel>('offset_interpolated');
  const [uses, setUses] = useState<Record<string, CheckUse>>(() => defaultUses(checks));
  const [failure, setFailure] = useState<string | null>(null);
  const active = activeCorrection([...corrections], session.id);

  const preview = useMemo((): { record: CorrectionRecord } | { problem: string } => {
    try {
      const fitOn = checksFor(checks, uses, 'fit');
      if (fitOn.length === 0) return { problem: 'Choose at least one check to fit on.' };
      const at = new Date().toISOString();
      return { record: buildCorrection({ id: `${session.id}-correction-${globalThis.crypto.randomUUID()}`, sessionId: session.id, model, fitOn, heldOut: checksFor(checks, uses, 'held_out'), display: session.display, createdBy: operator?.id ?? 'nobody', createdAt: at }) };
    } catch (error) {
      if (error instanceof RangeError) return { problem: error.message };
      throw error;
    }
  }, [checks, uses, model, session, operator]);

  const apply = async () => {
    if (!operator || !('record' in preview)) return;
    const record = { ...preview.record, createdAt: new Date().toISOString(), createdBy: operator.id };
    await store.put('corrections', record, { operatorId: operator.id, action: 'apply_correction', summary: `session ${session.id}: ${model} on ${record.fromValidationIds.length} checks` }).catch((e: Error) => setFailure(`Could not save the correction: ${e.message}`));
  };
  const remove = async (record: CorrectionRecord) => {
    if (!operator) return;
    await store.put('corrections', removedCorrection(record, new Date().toISOString()), { operatorId: operator.id, action: 'remove_correction', summary: `session ${session.id}: ${record.model}` }).catch((e: Error) => setFailure(`Could not remove the correction: ${e.message}`));
  };

  return (
    <section className="panel" aria-labelledby="corrections-heading">
      <h3 id="corrections-heading">Correction</h3>
      <CorrectionStatus active={active} corrections={corrections} onRemove={operator ? remove : null} />
      {!active && (
        <div className="correction-form" role="group" aria-label="New correction">
          <label className="field">
            Model
            <select value={model} onChange={(e) => setModel(e.target.value as CorrectionModel)}>
              {correctionModels.map((m) => (
                <option key={m} value={m}>
                  {modelLabels[m]}
                </option>
              ))}
            </select>
          </label>
          <table className="quality-table" aria-label="Checks to fit on">
            <thead>
              <tr>
                <th scope="col">Check</th>
                <th scope="col">Mean accuracy</th>
                <th scope="col">Use</th>
              </tr>
            </thead>
            <tbody>
              {checks.map((v) => (
                <tr key={v.id}>
                  <th scope="row">{`${v.kind === 'validation' ? 'Validation' : 'Drift check'} at ${timeOf(v)}`}</th>
                  <td>{formatDeg(v.meanAccuracyDeg)}</td>
                  <td role="radiogroup" aria-label={`Use of the ${v.kind === 'validation' ? 'validation' : 'drift check'} at ${timeOf(v)}`}>
                    {(['fit', 'held_out', 'unused'] as const).map((u) => (
                      <label key={u} className="check">
                        <input type="radio" name={`use-${v.id}`} checked={(uses[v.id] ?? 'unused') === u} onChange={() => setUses((all) => ({ ...all, [v.id]: u }))} /> {useLabels[u]}
                      </label>
                    ))}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {'record' in preview ? (
            <p data-testid="correction-preview">
              Fitted on {preview.record.fit.points} points, RMS residual {preview.record.fit.rmsResidualPx?.toFixed(2) ?? 'n/a'} px. Held-out error: {formatDeg(preview.record.fit.heldOutErrorBeforeDeg)} without, {formatDeg(preview.record.fit.heldOutErrorAfterDeg)} with the correction.
            </p>
          ) : (
            <p className="warning" role="alert">
              {preview.problem}
            </p>
          )}
          <button type="button" disabled={!operator || !('record' in preview)} onClick={() => void apply()}>
            Apply the correction
          </button>
        </div>
      )}
      {failure && (
        <p className="failure" role="alert">
          {failure}
        </p>
      )}
    </section>
  );
}
