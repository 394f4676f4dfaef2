import type { GazeHello, GazeSample } from '../gaze-sample';
import { GrowableFloat64 } from './growable-float64';
import { percentileInPlace } from './percentile';
import { SequenceLoss } from './sequence-loss';
import { TimestampGapLoss } from './timestamp-gap-loss';

export interface FeedQuality {
  readonly samples: number;
  /** From sequence numbers where every sample of a hello's stretch carried one, else from timestamp gaps. */
  readonly lost: number;
  readonly outOfOrder: number;
  readonly garbageLines: number;
  /** The first distinct garbage reasons, with how often each came. */
  readonly garbageReasons: readonly { readonly reason: string; readonly count: number }[];
  readonly hellos: number;
  readonly lossFrom: 'seq' | 'timestamps' | null;
  /** The latest hello's rate. */
  readonly nominalRateHz: number | null;
  /** (samples - 1) / (last - first timestamp), summed over the stretches between hellos. */
  readonly measuredRateHz: number | null;
  /** 99th percentile of |arrival interval - nominal interval|, ms. */
  readonly jitterMsP99: number | null;
}

const MAX_REASONS = 20;

/** One hello's stretch of samples: a new hello means the tracker restarted its numbering and clock. */
class Stretch {
  readonly bySeq = new SequenceLoss();
  readonly byGap: TimestampGapLoss;
  everySampleHasSeq = true;
  samples = 0;
  firstS = Number.POSITIVE_INFINITY;
  lastS = Number.NEGATIVE_INFINITY;
  previousArrivalNs: number | null = null;

  constructor(readonly rateHz: number) {
    this.byGap = new TimestampGapLoss(rateHz);
  }

  get usesSeq(): boolean {
    return this.everySampleHasSeq && this.samples > 0;
  }
}

/**
 * Counts what a feed delivered: samples, losses, out-of-order arrivals, garbage, the
 * measured rate and the arrival jitter. The same object serves `gazeloom feed check`
 * and tests; it keeps 8 bytes per sample for the exact jitter percentile.
 */
export class FeedQualityCounter {
  private readonly stretches: Stretch[] = [];
  private readonly jitterMs = new GrowableFloat64();
  private readonly reasons = new Map<string, number>();
  private garbageLines = 0;

  hello(hello: GazeHello): void {
    this.stretches.push(new Stretch(hello.rateHz));
  }

  sample(sample: GazeSample, arrivalNs: number): void {
    const s = this.stretches.at(-1);
    if (!s) throw new Error('FeedQualityCounter: sample() before hello()');
    s.samples++;
    s.firstS = Math.min(s.firstS, sample.trackerTimeS);
    s.lastS = Math.max(s.lastS, sample.trackerTimeS);
    if (sample.seq === null) s.everySampleHasSeq = false;
    else s.bySeq.add(sample.seq);
    s.byGap.add(sample.trackerTimeS);
    if (s.previousArrivalNs !== null) this.jitterMs.push(Math.abs((arrivalNs - s.previousArrivalNs) / 1e6 - 1000 / s.rateHz));
    s.previousArrivalNs = arrivalNs;
  }

  garbage(reason: string): void {
    this.garbageLines++;
    const known = this.reasons.get(reason);
    if (known !== undefined) this.reasons.set(reason, known + 1);
    else if (this.reasons.size < MAX_REASONS) this.reasons.set(reason, 1);
  }

  report(): FeedQuality {
    const withSamples = this.stretches.filter((s) => s.samples > 0);
    let lost = 0;
    let outOfOrder = 0;
    let intervals = 0;
    let spanS = 0;
    for (const s of withSamples) {
      lost += s.usesSeq ? s.bySeq.lost : s.byGap.lost;
      outOfOrder += s.usesSeq ? s.bySeq.outOfOrder : s.byGap.outOfOrder;
      intervals += s.samples - 1;
      spanS += s.lastS - s.firstS;
    }
    return {
      samples: withSamples.reduce((n, s) => n + s.samples, 0),
      lost,
      outOfOrder,
      garbageLines: this.garbageLines,
      garbageReasons: [...this.reasons].map(([reason, count]) => ({ reason, count })),
      hellos: this.stretches.length,
      lossFrom: withSamples.length === 0 ? null : withSamples.every((s) => s.usesSeq) ? 'seq' : 'timestamps',
      nominalRateHz: this.stretches.at(-1)?.rateHz ?? null,
      measuredRateHz: spanS > 0 ? intervals / spanS : null,
      jitterMsP99: percentileInPlace(this.jitterMs.toArray(), 99),
    };
  }
}
