import type { EventBatch, SensorSize, TimeResolution } from './event-batch';

/**
 * Gazeloom's CSV form of an event stream, the one `events convert` writes and the text
 * decoder reads back losslessly: a size comment, a header, then one event per line with t
 * as an integer in the stream's resolution (column `t`, microseconds, or `t_ns`).
 *   # width=640 height=480
 *   t,x,y,p
 *   1000017,312,40,1
 */
export function csvPreamble(sensor: SensorSize, resolution: TimeResolution): string {
  return `# width=${sensor.width} height=${sensor.height}\n${resolution === 'ns' ? 't_ns' : 't'},x,y,p\n`;
}

export function csvRows(batch: EventBatch, resolution: TimeResolution): string {
  const { t, x, y, p } = batch;
  const scale = resolution === 'ns' ? 1000 : 1;
  const lines = new Array<string>(t.length);
  for (let i = 0; i < t.length; i++) lines[i] = `${Math.round(t[i]! * scale)},${x[i]},${y[i]},${p[i]}\n`;
  return lines.join('');
}
