import type { EnvelopePoints } from './delay-envelope';

/**
 * The delay envelope of a whole recording at once (the batch counterpart of DelayEnvelope):
 * for each window of `windowS` tracker seconds, counted from the earliest tracker time, the
 * sample with the least delay d = arrival − tracker after removing the drift `trendSlope`
 * per tracker second. Independent of the order of the pairs (ties go to the earlier tracker
 * time). Windows without samples are simply absent, so a gap costs nothing.
 */
export function windowMinima(
  trackerTimeS: ArrayLike<number>,
  arrivalHostS: ArrayLike<number>,
  windowS: number,
  trendSlope: number,
): EnvelopePoints & { readonly spanS: number } {
  if (!(Number.isFinite(windowS) && windowS > 0)) throw new RangeError(`windowS must be a positive number of seconds, got ${windowS}`);
  let originTS = Infinity;
  let latestTS = -Infinity;
  for (let i = 0; i < trackerTimeS.length; i++) {
    const t = trackerTimeS[i]!;
    if (!Number.isFinite(t)) throw new RangeError(`pairs.trackerTimeS[${i}] must be a finite number of seconds, got ${t}`);
    if (!Number.isFinite(arrivalHostS[i])) throw new RangeError(`pairs.arrivalHostS[${i}] must be a finite number of seconds, got ${arrivalHostS[i]}`);
    originTS = Math.min(originTS, t);
    latestTS = Math.max(latestTS, t);
  }
  const best = new Map<number, number>();
  const key = (i: number): number => arrivalHostS[i]! - trackerTimeS[i]! - trendSlope * (trackerTimeS[i]! - originTS);
  for (let i = 0; i < trackerTimeS.length; i++) {
    const index = Math.floor((trackerTimeS[i]! - originTS) / windowS);
    const j = best.get(index);
    if (j === undefined || key(i) < key(j) || (key(i) === key(j) && trackerTimeS[i]! < trackerTimeS[j]!)) best.set(index, i);
  }
  const order = [...best.keys()].sort((a, b) => a - b).map((index) => best.get(index)!);
  const originDS = order.length > 0 ? arrivalHostS[order[0]!]! - trackerTimeS[order[0]!]! : 0;
  return {
    x: Float64Array.from(order, (i) => trackerTimeS[i]! - originTS),
    y: Float64Array.from(order, (i) => arrivalHostS[i]! - trackerTimeS[i]! - originDS),
    originTS,
    originDS,
    spanS: order.length > 0 ? latestTS - originTS : 0,
  };
}
