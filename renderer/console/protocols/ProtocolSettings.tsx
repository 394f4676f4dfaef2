import type { ProtocolRecord } from '../../../app/core/study/records';
import { PLAYBACK_SPEEDS } from '../../../app/core/study/protocol-defaults';

const counterbalancings: { value: ProtocolRecord['counterbalancing']['kind']; label: string }[] = [
  { value: 'latin-square', label: 'Balanced Latin square (Williams), row by enrolment number' },
  { value: 'seeded-shuffle', label: 'Seeded shuffle (xoshiro128**, seed recorded per session)' },
  { value: 'none', label: 'None: the order of the steps' },
];

/** Counterbalancing, drift checks, validation layout, thresholds, look and speed of a protocol. */
export function ProtocolSettings({ draft, onChange }: { draft: ProtocolRecord; onChange: (draft: ProtocolRecord) => void }) {
  const threshold = (key: keyof ProtocolRecord['thresholds'], label: string) => (
    <label>
      {label}{' '}
      <input
        aria-label={label}
        type="number"
        step={0.1}
        min={0.1}
        value={draft.thresholds[key]}
        onChange={(e) => onChange({ ...draft, thresholds: { ...draft.thresholds, [key]: Number(e.target.value) } })}
        size={4}
      />
    </label>
  );
  return (
    <>
      <label className="field">
        Protocol name
        <input value={draft.name} onChange={(e) => onChange({ ...draft, name: e.target.value })} />
      </label>
      <fieldset>
        <legend>Order of clips in blocks</legend>
        <label className="field">
          Counterbalancing
          <select
            value={draft.counterbalancing.kind}
            onChange={(e) => {
              const kind = e.target.value as ProtocolRecord['counterbalancing']['kind'];
              onChange({ ...draft, counterbalancing: kind === 'seeded-shuffle' ? { kind, generator: 'xoshiro128**' } : { kind } });
            }}
          >
            {counterbalancings.map((c) => (
              <option key={c.value} value={c.value}>
                {c.label}
              </option>
            ))}
          </select>
        </label>
        <label>
          Drift check every{' '}
          <input
            aria-label="Drift check every N clips (0 for none)"
            type="number"
            min={0}
            value={draft.driftCheckEvery ?? 0}
            onChange={(e) => {
              const n = Math.round(Number(e.target.value));
              onChange({ ...draft, driftCheckEvery: n > 0 ? n : null });
            }}
            size={3}
          />{' '}
          clips of a block
        </label>
      </fieldset>
      <fieldset>
        <legend>Quality</legend>
        <label>
          Validation points{' '}
          <select value={draft.validationLayout} onChange={(e) => onChange({ ...draft, validationLayout: Number(e.target.value) as 5 | 9 | 13 })}>
            <option value={5}>5</option>
            <option value={9}>9</option>
            <option value={13}>13</option>
          </select>
        </label>{' '}
        {threshold('validationMeanDeg', 'Validation mean accuracy limit (deg)')} {threshold('validationMaxDeg', 'Validation worst point limit (deg)')}{' '}
        {threshold('driftDeg', 'Drift limit (deg)')}
      </fieldset>
      <fieldset>
        <legend>Clip display</legend>
        <label>
          Look{' '}
          <select value={draft.look} onChange={(e) => onChange({ ...draft, look: e.target.value as ProtocolRecord['look'] })}>
            <option value="polarity">polarity colours</option>
            <option value="decay">decay</option>
            <option value="grey">grey accumulation</option>
          </select>
        </label>{' '}
        <label>
          Speed{' '}
          <select value={draft.speed} onChange={(e) => onChange({ ...draft, speed: Number(e.target.value) })}>
            {PLAYBACK_SPEEDS.map((s) => (
              <option key={s} value={s}>
                {s}×
              </option>
            ))}
          </select>
        </label>
      </fieldset>
    </>
  );
}
