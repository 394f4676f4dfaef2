import { useState } from 'react';
import { targetResult, type ValidationRecord } from '../../../app/core/study/records';
import { useLabQuery } from '../lab/use-lab-query';
import { mergeRepeatedPoints } from './repeat-points';
import type { RunContext } from './use-session-runner';

const deg = (v: number | null) => (v === null ? 'n/a' : `${v.toFixed(2)}°`);

/**
 * The session's last validation point by point, and a way to measure chosen points again
 * (a target failed, the participant blinked): only those targets are shown, and their new
 * results are merged with the others into a new validation record.
 */
export function RepeatPoints({ ctx, busy }: { ctx: RunContext; busy: boolean }) {
  const { api, store, session, protocol, operatorId } = ctx;
  const last = useLabQuery(['validations'], (s) => s.list('validations', { sessionId: session.id, kind: 'validation' }).then((all) => all.sort((a, b) => a.hostNs - b.hostNs).at(-1) ?? null), [session.id]);
  const [chosen, setChosen] = useState<ReadonlySet<number>>(new Set());
  const [state, setState] = useState<{ running: boolean; text: string | null; failure: string | null }>({ running: false, text: null, failure: null });
  if (!last) return null;

  const repeat = async (v: ValidationRecord) => {
    const indices = [...chosen].sort((a, b) => a - b);
    setState({ running: true, text: null, failure: null });
    const r = await api.runTargetProcedure({ purpose: 'validation', points: indices.map((i) => ({ x: v.points[i]!.x, y: v.points[i]!.y })), order: 'random' });
    if (!r.ok) return setState({ running: false, text: null, failure: `The points were not repeated: ${r.message}` });
    const repeated = r.value.points.map((p) => ({ index: indices[p.index]!, result: targetResult.parse(p) }));
    const { record, reasons } = mergeRepeatedPoints({ last: v, repeated, thresholds: protocol.thresholds, hostNs: r.value.startedHostNs, at: new Date().toISOString(), id: `${v.trialId}-validation-points-${globalThis.crypto.randomUUID()}` });
    try {
      await store.put('validations', record, { operatorId, action: 'repeat_points', summary: `trial ${v.trialId}: points ${indices.map((i) => i + 1).join(', ')} repeated, ${record.accepted ? 'accepted' : 'not accepted'}` });
    } catch (error) {
      return setState({ running: false, text: null, failure: `Could not save the result: ${(error as Error).message}` });
    }
    setChosen(new Set());
    setState({ running: false, text: `Points ${indices.map((i) => i + 1).join(', ')} repeated: mean ${deg(record.meanAccuracyDeg)}, worst point ${deg(record.maxAccuracyDeg)}, ${record.accepted ? 'accepted' : `not accepted (${reasons.join('; ')})`}.`, failure: null });
  };
  const toggle = (i: number) => setChosen((s) => (s.has(i) ? new Set([...s].filter((x) => x !== i)) : new Set([...s, i])));

  return (
    <details className="panel">
      <summary>Last validation, point by point ({last.accepted ? 'accepted' : 'not accepted'})</summary>
      <table className="step-table" aria-label="Points of the last validation">
        <thead>
          <tr>
            <th>Repeat</th>
            <th>Point</th>
            <th>Target (px)</th>
            <th>Accuracy</th>
            <th>Data loss</th>
          </tr>
        </thead>
        <tbody>
          {last.points.map((p, i) => (
            <tr key={i}>
              <td>
                <input type="checkbox" aria-label={`Repeat point ${i + 1}`} checked={chosen.has(i)} onChange={() => toggle(i)} />
              </td>
              <td>{i + 1}</td>
              <td>
                {p.x.toFixed(0)}, {p.y.toFixed(0)}
              </td>
              <td>{deg(p.accuracyDeg)}</td>
              <td>{p.dataLossPct.toFixed(1)} %</td>
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" className="secondary" disabled={busy || state.running || chosen.size === 0} onClick={() => void repeat(last)}>
        {state.running ? 'Repeating the points…' : `Repeat the chosen points (${chosen.size})`}
      </button>
      {state.text && <p role="status">{state.text}</p>}
      {state.failure && (
        <p className="failure" role="alert">
          {state.failure}
        </p>
      )}
    </details>
  );
}
