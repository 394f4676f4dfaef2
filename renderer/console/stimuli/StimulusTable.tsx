import type { StimulusMeta } from '../../../app/contract';
import { formatCount, formatDuration } from '../format';

interface Props {
  readonly stimuli: readonly StimulusMeta[];
  readonly selectedId: string | null;
  readonly onSelect: (id: string) => void;
}

/** The library as a table; arrow keys move the selection when the table has focus. */
export function StimulusTable({ stimuli, selectedId, onSelect }: Props) {
  const move = (step: number) => {
    const index = stimuli.findIndex((s) => s.id === selectedId);
    const next = stimuli[Math.min(stimuli.length - 1, Math.max(0, index + step))];
    if (next) onSelect(next.id);
  };
  return (
    <table
      className="stimulus-table"
      tabIndex={0}
      aria-label="Stimuli"
      onKeyDown={(event) => {
        if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
          event.preventDefault();
          move(event.key === 'ArrowDown' ? 1 : -1);
        }
      }}
    >
      <thead>
        <tr>
          <th scope="col">Name</th>
          <th scope="col">Duration</th>
          <th scope="col">Events</th>
          <th scope="col">Sensor</th>
          <th scope="col">Flash</th>
        </tr>
      </thead>
      <tbody>
        {stimuli.map((s) => (
          <tr key={s.id} aria-selected={s.id === selectedId} className={s.id === selectedId ? 'selected' : undefined} onClick={() => onSelect(s.id)}>
            <td>
              {s.name}
              {s.demo && <span className="badge">demo</span>}
            </td>
            <td>{formatDuration(s.durationS)}</td>
            <td>{formatCount(s.eventCount)}</td>
            <td>
              {s.sensor.width}×{s.sensor.height}
            </td>
            <td>{!s.flash ? <span className="badge">not screened</span> : s.flash.pass ? 'passes' : <span className="badge badge-warn">fails</span>}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
