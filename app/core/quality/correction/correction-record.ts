import type { DisplayGeometry } from '../../geometry/display-geometry';
import type { CorrectionModel, CorrectionRecord, ValidationRecord } from '../../study/records';
import { meanErrorDeg, pairsFromValidations } from './check-pairs';
import { correctionMap, fitCorrection } from './models';

export interface CorrectionRequest {
  readonly id: string;
  readonly sessionId: string;
  readonly model: CorrectionModel;
  /** The session's validations and drift checks to fit on, and those held out to judge the fit. */
  readonly fitOn: readonly ValidationRecord[];
  readonly heldOut: readonly ValidationRecord[];
  readonly display: DisplayGeometry;
  readonly createdBy: string;
  readonly createdAt: string;
}

/**
 * A correction fitted and judged, as the record to store (switched on): its parameters,
 * the checks it came from and those held out, the fit's residual and the held-out error
 * (mean angle to the targets) without and with it. Throws a RangeError when a check is of
 * another session, is both fitted on and held out, or the points cannot fit the model.
 */
export function buildCorrection(r: CorrectionRequest): CorrectionRecord {
  const fitIds = r.fitOn.map((v) => v.id);
  for (const v of [...r.fitOn, ...r.heldOut]) if (v.sessionId !== r.sessionId) throw new RangeError(`check ${v.id} belongs to session ${v.sessionId}, not ${r.sessionId}`);
  const both = r.heldOut.find((v) => fitIds.includes(v.id));
  if (both) throw new RangeError(`check ${both.id} cannot be both fitted on and held out`);
  const pairs = pairsFromValidations(r.fitOn, r.display);
  const fit = fitCorrection(r.model, pairs);
  const held = pairsFromValidations(r.heldOut, r.display);
  const map = correctionMap({ model: r.model, params: fit.params });
  return {
    id: r.id,
    sessionId: r.sessionId,
    model: r.model,
    params: fit.params,
    fromValidationIds: fitIds,
    heldOutValidationIds: r.heldOut.map((v) => v.id),
    fit: { points: pairs.length, rmsResidualPx: fit.rmsResidualPx, heldOutErrorBeforeDeg: meanErrorDeg(held, r.display, null), heldOutErrorAfterDeg: meanErrorDeg(held, r.display, map) },
    createdAt: r.createdAt,
    createdBy: r.createdBy,
    enabled: true,
    removedAt: null,
  };
}
