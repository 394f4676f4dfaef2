import type { FlashScreening } from '../../../app/contract';

type LookResult = FlashScreening['looks'][number];

interface Props {
  readonly result: LookResult;
  readonly durationS: number;
  /** Seconds from the clip's first event, shown as a cursor. */
  readonly cursorS: number;
  readonly onPick: (seconds: number) => void;
}

const WIDTH = 600;
const HEIGHT = 18;

/** One look's screening on the clip's timeline: failing time ranges in red-orange, the shown time as a line. */
export function FlashTimeline({ result, durationS, cursorS, onPick }: Props) {
  const x = (s: number) => (Math.min(durationS, Math.max(0, s)) / Math.max(durationS, 1e-9)) * WIDTH;
  const ranges = result.failures.map((f) => `${f.start_s.toFixed(2)}–${f.end_s.toFixed(2)} s`);
  const label = `${result.look} look: ${result.pass ? 'passes over the whole clip' : `fails at ${ranges.join(', ')}`}`;
  return (
    <div className="flash-timeline">
      <span className="flash-timeline-look">{result.look}</span>
      <svg
        role="img"
        aria-label={label}
        viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
        preserveAspectRatio="none"
        width="100%"
        height={HEIGHT}
        onClick={(event) => {
          const box = event.currentTarget.getBoundingClientRect();
          onPick(((event.clientX - box.left) / box.width) * durationS);
        }}
      >
        <rect x={0} y={0} width={WIDTH} height={HEIGHT} fill={result.pass ? '#d9ece6' : '#eeeeee'} />
        {result.failures.map((f, i) => (
          <rect key={i} x={x(f.start_s)} y={0} width={Math.max(2, x(f.end_s) - x(f.start_s))} height={HEIGHT} fill={f.kind === 'red' ? '#a3122a' : '#d9541e'}>
            <title>{`${f.kind} flashing, ${f.flashes_per_s} a second, ${f.start_s.toFixed(2)}–${f.end_s.toFixed(2)} s`}</title>
          </rect>
        ))}
        <line x1={x(cursorS)} x2={x(cursorS)} y1={0} y2={HEIGHT} stroke="#1c1c1c" strokeWidth={2} />
      </svg>
      <span className="flash-timeline-verdict">{result.pass ? 'passes' : `${result.failures.length} failing`}</span>
    </div>
  );
}
