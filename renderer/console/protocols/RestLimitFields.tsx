import { DEFAULT_REST_LIMITS, restLimitsOf, type RestLimits } from '../../../app/core/study/rest-limits';
import type { ProtocolRecord } from '../../../app/core/study/records';

const fields: { key: keyof RestLimits; label: string; step: number }[] = [
  { key: 'warnAfterMin', label: 'Warn after minutes of viewing without a rest', step: 1 },
  { key: 'requireRestAfterMin', label: 'Require a rest after minutes of viewing', step: 1 },
  { key: 'requiredRestMin', label: 'Required rest (minutes)', step: 0.5 },
  { key: 'sessionWarnAfterMin', label: 'Warn when the session has run (minutes)', step: 1 },
];

/** The protocol's rest limits (defaults 20, 40, 2 and 60 minutes: common practice, no source). */
export function RestLimitFields({ draft, onChange }: { draft: ProtocolRecord; onChange: (draft: ProtocolRecord) => void }) {
  const limits = restLimitsOf(draft);
  return (
    <fieldset>
      <legend>Rest limits</legend>
      {fields.map((f) => (
        <label key={f.key}>
          {f.label}{' '}
          <input
            aria-label={f.label}
            type="number"
            step={f.step}
            min={f.step}
            value={limits[f.key]}
            onChange={(e) => onChange({ ...draft, restLimits: { ...limits, [f.key]: Number(e.target.value) } })}
            size={4}
          />
        </label>
      ))}{' '}
      <button type="button" className="secondary" onClick={() => onChange({ ...draft, restLimits: { ...DEFAULT_REST_LIMITS } })}>
        Default limits
      </button>
    </fieldset>
  );
}
