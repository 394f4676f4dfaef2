import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ManualClock } from '../../app/core/clock/host-clock';
import { createHost } from '../../app/host/create-host';
import { createHostLog } from '../../app/host/log';
import { browserStagePresenter } from '../../app/host/stage-presenter';

// The whole host, as browser mode composes it: a stage page that connects while the stage is
// blanked (a reload, a crash of the page) must be told to show the blank at once.
const DISPLAY = { widthMm: 530, heightMm: 298, widthPx: 1920, heightPx: 1080, distanceMm: 600 };
const STATUS = { visible: true, width: 1920, height: 1080, devicePixelRatio: 1, renderer: 'webgl2' as const };

describe('a stage page connecting during a blank', () => {
  it('gets the blank command as soon as it reports, and none once the blank has ended', async () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'gz-reblank-'));
    const host = createHost({ mode: 'browser', dataDir, clock: new ManualClock(1e9), log: createHostLog({ file: null, echo: false }), stage: browserStagePresenter(() => 'about:blank'), noDemo: true });
    try {
      const console1 = host.attach('console', () => {});
      expect(await console1.dispatch('startRecording', { source: { kind: 'simulated', seed: 1, rateHz: 250 }, display: DISPLAY })).toMatchObject({ ok: true });
      expect(await console1.dispatch('blankStage', { reason: 'participant unwell' })).toMatchObject({ ok: true });

      const commands: unknown[] = [];
      const stage = host.attach('stage', (event, payload) => {
        if (event === 'onStageCommand') commands.push(payload);
      });
      expect(await stage.dispatch('reportStageStatus', STATUS)).toMatchObject({ ok: true });
      expect(commands).toContainEqual({ type: 'setBlank', blanked: true });

      expect(await console1.dispatch('unblankStage', {})).toMatchObject({ ok: true });
      commands.length = 0;
      expect(await stage.dispatch('reportStageStatus', STATUS)).toMatchObject({ ok: true });
      expect(commands).not.toContainEqual({ type: 'setBlank', blanked: true });
      await console1.dispatch('stopRecording', {});
    } finally {
      await host.close();
      rmSync(dataDir, { recursive: true, force: true });
    }
  });
});
