import { simulateEvents } from '../../app/core/sim/simulate';
import { rate, type Benchmark } from './harness';

/** The full warehouse scene at 640x480 with every default (1 kHz internal rate, noise and hot pixels on). */
export const benchmark: Benchmark = {
  name: 'simulated event camera, 640x480 warehouse aisle',
  async run(log) {
    const durationS = 4;
    simulateEvents({ scene: 'warehouse', durationS: 0.05, seed: 2 }).next(); // warm up
    const start = process.hrtime.bigint();
    let events = 0;
    let rows = 0;
    for (const slice of simulateEvents({ scene: 'warehouse', durationS, seed: 1 })) {
      events += slice.events.t.length;
      rows += slice.tracks.length;
    }
    const wallS = Number(process.hrtime.bigint() - start) / 1e9;
    log(`${events} events and ${rows} track rows for ${durationS} s simulated in ${wallS.toFixed(2)} s (${(events / durationS / 1e6).toFixed(2)} M events per simulated second)`);
    // No other simulator runs here to compare with, so there is no peer.
    return [
      rate('simulation speed, events (640x480 warehouse)', events / wallS, 'events/s'),
      rate('simulation speed, simulated time (640x480 warehouse)', durationS / wallS, 'simulated s per wall s'),
    ];
  },
};
