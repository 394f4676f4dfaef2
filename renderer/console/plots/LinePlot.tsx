import { useEffect, useMemo, useRef, useState } from 'react';
import { decimateToColumns } from './decimate';
import { buildDrawPath, seriesExtent, strokeDrawPath } from './draw-path';

export interface Series {
  readonly label: string;
  readonly xs: ArrayLike<number>;
  readonly ys: ArrayLike<number>;
  readonly colour: string;
}

export interface ThresholdLine {
  readonly label: string;
  readonly y: number;
  readonly colour: string;
}

interface Props {
  readonly title: string;
  readonly series: readonly Series[];
  readonly xLabel: string;
  readonly yLabel: string;
  readonly thresholds?: readonly ThresholdLine[];
  readonly height?: number;
  /** Marks a position on the x axis (e.g. the preview's current time). */
  readonly cursorX?: number | null;
  readonly onPick?: (x: number) => void;
}

const margin = { left: 64, right: 12, top: 10, bottom: 34 };

function niceTicks(lo: number, hi: number, count: number): number[] {
  const span = hi - lo || 1;
  const raw = span / count;
  const step = [1, 2, 5, 10].map((m) => m * 10 ** Math.floor(Math.log10(raw))).find((s) => s >= raw) ?? raw;
  const ticks: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

/**
 * A canvas line plot that stays responsive on millions of points (min/max decimation per
 * pixel column), with axes, threshold lines, a hover read-out and click-to-pick.
 */
export function LinePlot({ title, series, xLabel, yLabel, thresholds = [], height = 180, cursorX = null, onPick }: Props) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const [width, setWidth] = useState(600);
  const [hover, setHover] = useState<{ x: number; y: number } | null>(null);

  useEffect(() => {
    const element = canvas.current?.parentElement;
    if (!element) return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.max(200, Math.floor(entry!.contentRect.width))));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  const extent = useMemo(() => seriesExtent(series), [series]);
  const x0 = extent?.x0 ?? Infinity;
  const x1 = extent?.x1 ?? -Infinity;
  let y0 = extent?.y0 ?? Infinity;
  let y1 = extent?.y1 ?? -Infinity;
  for (const t of thresholds) {
    y0 = Math.min(y0, t.y);
    y1 = Math.max(y1, t.y);
  }
  const empty = !Number.isFinite(x0) || !Number.isFinite(y0);
  if (!empty) {
    y0 = Math.min(0, y0);
    if (y1 === y0) y1 = y0 + 1;
    y1 += (y1 - y0) * 0.05;
  }
  const plotW = width - margin.left - margin.right;
  const plotH = height - margin.top - margin.bottom;
  // Decimated once per data and width, not on every hover: a whole session is millions of points.
  const columns = useMemo(() => (empty ? [] : series.map((s) => decimateToColumns(s.xs, s.ys, x0, x1, Math.max(1, Math.floor(plotW))))), [series, empty, x0, x1, plotW]);
  const toPx = (x: number) => margin.left + ((x - x0) / (x1 - x0 || 1)) * plotW;
  const toPy = (y: number) => margin.top + plotH - ((y - y0) / (y1 - y0)) * plotH;

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    const ratio = window.devicePixelRatio || 1;
    c.width = width * ratio;
    c.height = height * ratio;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    ctx.clearRect(0, 0, width, height);
    ctx.font = '11px system-ui, sans-serif';
    ctx.fillStyle = '#5d6873';
    ctx.strokeStyle = '#d9ddd8';
    if (empty) {
      ctx.fillText('no data', margin.left + 8, margin.top + 16);
      return;
    }
    for (const t of niceTicks(y0, y1, 4)) {
      const py = toPy(t);
      ctx.beginPath();
      ctx.moveTo(margin.left, py);
      ctx.lineTo(width - margin.right, py);
      ctx.stroke();
      ctx.fillText(t.toLocaleString('en-GB'), 4, py + 4);
    }
    for (const t of niceTicks(x0, x1, 6)) {
      const px = toPx(t);
      ctx.fillText(t.toLocaleString('en-GB'), px - 8, height - margin.bottom + 14);
    }
    ctx.fillText(xLabel, margin.left + plotW / 2 - 20, height - 4);
    series.forEach((s, i) => {
      ctx.strokeStyle = s.colour;
      ctx.lineWidth = 1.25;
      strokeDrawPath(ctx, buildDrawPath(columns[i]!, margin.left, toPy));
      ctx.stroke();
    });
    for (const t of thresholds) {
      ctx.strokeStyle = t.colour;
      ctx.setLineDash([5, 4]);
      ctx.beginPath();
      ctx.moveTo(margin.left, toPy(t.y));
      ctx.lineTo(width - margin.right, toPy(t.y));
      ctx.stroke();
      ctx.setLineDash([]);
      ctx.fillStyle = t.colour;
      ctx.fillText(t.label, width - margin.right - 80, toPy(t.y) - 3);
    }
    if (cursorX !== null) {
      ctx.strokeStyle = '#1d2329';
      ctx.beginPath();
      ctx.moveTo(toPx(cursorX), margin.top);
      ctx.lineTo(toPx(cursorX), margin.top + plotH);
      ctx.stroke();
    }
  });

  const xAt = (clientX: number) => {
    const rect = canvas.current!.getBoundingClientRect();
    return x0 + ((clientX - rect.left - margin.left) / plotW) * (x1 - x0);
  };

  return (
    <figure className="plot">
      <figcaption>
        {title} <span className="muted">({yLabel})</span>
        {hover && !empty && (
          <span className="readout">
            {' '}
            {xLabel} {hover.x.toPrecision(4)}
          </span>
        )}
      </figcaption>
      <canvas
        ref={canvas}
        style={{ width: `${width}px`, height: `${height}px` }}
        role="img"
        aria-label={`${title}: ${yLabel} against ${xLabel}`}
        onMouseMove={(e) => setHover({ x: xAt(e.clientX), y: 0 })}
        onMouseLeave={() => setHover(null)}
        onClick={(e) => onPick?.(xAt(e.clientX))}
      />
    </figure>
  );
}
