import type { FlashScreening } from '../../../app/contract';

const WIDTH = 240;

/** The screening display with every failing region drawn where it falls on the screen. */
export function FlashRegions({ screening }: { screening: FlashScreening }) {
  const { widthPx, heightPx } = screening.analysedWith.display;
  const height = (WIDTH * heightPx) / widthPx;
  const failures = screening.looks.flatMap((l) => l.failures.map((f) => ({ ...f, look: l.look })));
  const scale = WIDTH / widthPx;
  return (
    <svg className="flash-regions" role="img" aria-label={`Screen regions that fail: ${failures.length}`} viewBox={`0 0 ${WIDTH} ${height}`} width={WIDTH} height={height}>
      <rect x={0} y={0} width={WIDTH} height={height} fill="#808080" stroke="#1c1c1c" />
      {failures.map((f, i) => (
        <rect
          key={i}
          x={f.region.x_px * scale}
          y={f.region.y_px * scale}
          width={f.region.width_px * scale}
          height={f.region.height_px * scale}
          fill="none"
          stroke={f.kind === 'red' ? '#a3122a' : '#ffb81c'}
          strokeWidth={2}
        >
          <title>{`${f.look} look, ${f.kind}: ${f.region.width_px}×${f.region.height_px} px at (${f.region.x_px}, ${f.region.y_px})`}</title>
        </rect>
      ))}
    </svg>
  );
}
