import { useState } from 'react';
import type { Failure } from '../../../app/contract';
import { FailureNote } from '../FailureNote';
import { useHost } from '../host-context';

const rates = [1, 5, 10, 20, 50];

/**
 * Stage capacity check: a sweeping band at a chosen event rate, generated on the fly, to
 * see whether this display machine keeps up (late frames and draw time appear under Live).
 */
export function TestPatternControls() {
  const { api } = useHost();
  const [rate, setRate] = useState('10');
  const [size, setSize] = useState('640x480');
  const [failure, setFailure] = useState<Failure | null>(null);
  const play = async () => {
    const [width, height] = size.split('x').map(Number) as [number, number];
    const result = await api.playTestPattern({ eventsPerSecond: Number(rate) * 1e6, width, height, durationS: 10, look: 'polarity', placement: 'fit' });
    setFailure(result.ok ? null : result);
  };
  return (
    <section className="panel" aria-labelledby="capacity-heading">
      <h2 id="capacity-heading">Stage capacity check</h2>
      <div className="inline-fields">
        <label>
          Rate{' '}
          <select aria-label="Test pattern rate" value={rate} onChange={(e) => setRate(e.target.value)}>
            {rates.map((r) => (
              <option key={r} value={r}>
                {r} M events/s
              </option>
            ))}
          </select>
        </label>
        <label>
          Sensor{' '}
          <select aria-label="Test pattern sensor" value={size} onChange={(e) => setSize(e.target.value)}>
            <option value="640x480">640×480</option>
            <option value="1280x720">1280×720</option>
          </select>
        </label>
        <button type="button" className="secondary" onClick={() => void play()}>
          Play 10 s test pattern
        </button>
      </div>
      <p className="muted">Not for participants: it is a dense moving band. Watch “This clip” under Live for late frames and draw time.</p>
      {failure && <FailureNote failure={failure} />}
    </section>
  );
}
