import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from '@playwright/test';
import { startBrowserMode } from '../../app/host/browser-mode/start';
import { createHostLog } from '../../app/host/log';
import { createMonotonicClock } from '../../app/host/monotonic-clock';
import { duration, rate, type Benchmark, type BenchEntry } from './harness';
import { connectConsole } from './node-contract-client';

const RATES_M = (process.env.GZ_STAGE_RATES ?? '1,10,20,50').split(',').map(Number);
const SENSORS = [
  { width: 640, height: 480 },
  { width: 1280, height: 720 },
].filter((s) => !process.env.GZ_STAGE_WIDTH || String(s.width) === process.env.GZ_STAGE_WIDTH);
const SECONDS = Number(process.env.GZ_STAGE_SECONDS ?? 10);

/**
 * The stage playing the capacity test pattern in Debian's headless Chromium (software
 * WebGL2, 60 frames/s), streamed from the host as it plays, for 10 s per rate and sensor.
 * Target: 20 M events/s at 60 Hz with under 1 % late frames. No peer: the figures are the
 * share of late frames and the stage's own draw time per frame.
 */
export const benchmark: Benchmark = {
  name: 'stage playback in headless Chromium (test pattern, streamed)',
  async run(log) {
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-stage-bench-'));
    const rendererDir = join(process.cwd(), 'dist/renderer'); // npm run bench runs from the package root
    const mode = await startBrowserMode({ port: 0, dataDir, rendererDir, clock: createMonotonicClock(), log: createHostLog({ file: null, echo: false }), noDemo: true });
    const browser = await chromium.launch({
      executablePath: process.env.GAZELOOM_CHROMIUM ?? '/usr/bin/chromium',
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-quic', '--no-first-run'],
    });
    const stage = await (await browser.newContext({ viewport: { width: 1280, height: 720 } })).newPage();
    await stage.goto(`${mode.origin}/stage/?token=${mode.token}`);
    await stage.waitForSelector('body[data-ready="true"]');
    const { api, close } = await connectConsole(mode.origin, mode.token);
    const entries: BenchEntry[] = [];
    try {
      await new Promise((resolve) => setTimeout(resolve, 1500)); // the stage clock settles
      for (const sensor of SENSORS) {
        for (const m of RATES_M) {
          const started = await api.playTestPattern({ eventsPerSecond: m * 1e6, ...sensor, durationS: SECONDS, look: 'polarity', placement: 'fit' });
          if (!started.ok) throw new Error(started.message);
          let status;
          const giveUpAt = Date.now() + (SECONDS + 15) * 1000;
          for (;;) {
            await new Promise((resolve) => setTimeout(resolve, 500));
            status = await api.getLiveStatus({});
            if (!status.ok) throw new Error(status.message);
            if (status.value.playback === null) break;
            if (Date.now() > giveUpAt) {
              log(`${m} M events/s: the stage did not finish the pattern in time (its events arrived too slowly); stopping it`);
              await api.stopPlayback({});
              break;
            }
          }
          const f = status.value.clipFrames!;
          const latePct = (100 * f.late) / f.frames;
          const label = `${m} M events/s, ${sensor.width}x${sensor.height}`;
          log(`${label}: ${f.frames} frames, ${f.late} late (${latePct.toFixed(2)} %), draw p50 ${f.drawMsP50?.toFixed(2)} ms, p99 ${f.drawMsP99?.toFixed(2)} ms`);
          entries.push(rate(`stage playback ${label}: late frames`, latePct, '% of frames'));
          entries.push(duration(`stage playback ${label}: draw time p50`, f.drawMsP50 ?? Number.NaN, 'ms/frame'));
          entries.push(duration(`stage playback ${label}: draw time p99`, f.drawMsP99 ?? Number.NaN, 'ms/frame'));
        }
      }
    } finally {
      close();
      await browser.close();
      await mode.close();
    }
    return entries;
  },
};
