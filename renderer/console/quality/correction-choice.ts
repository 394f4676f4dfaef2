import type { CorrectionModel, ValidationRecord } from '../../../app/core/study/records';

export type CheckUse = 'fit' | 'held_out' | 'unused';

export const modelLabels: Record<CorrectionModel, string> = {
  offset: 'Constant offset',
  offset_interpolated: 'Offsets interpolated in time between checks',
  affine: 'Affine map (1, x, y)',
  polynomial2: 'Second-order polynomial (1, x, y, xy, x², y²)',
};

/**
 * The first choice offered: fit on every check, except that with two or more validations
 * the last one is held out, so the fit is judged on points it never saw.
 */
export function defaultUses(checks: readonly ValidationRecord[]): Record<string, CheckUse> {
  const validations = checks.filter((v) => v.kind === 'validation');
  const heldOut = validations.length >= 2 ? validations.at(-1)!.id : null;
  return Object.fromEntries(checks.map((v) => [v.id, v.id === heldOut ? 'held_out' : 'fit']));
}

export function checksFor(checks: readonly ValidationRecord[], uses: Readonly<Record<string, CheckUse>>, use: CheckUse): ValidationRecord[] {
  return checks.filter((v) => (uses[v.id] ?? 'unused') === use);
}
