import type { LiveStatus } from '../../../app/contract';

const fixed = (value: number | null, digits: number, unit: string) => (value === null ? '–' : `${value.toFixed(digits)} ${unit}`);

/** The live quality figures, with the no-sample alarm on top. */
export function MonitorFigures({ status }: { status: LiveStatus | null }) {
  if (!status) return <p className="muted">Waiting for the host…</p>;
  const lateShare = status.framesTotal > 0 ? (100 * status.framesLate) / status.framesTotal : null;
  return (
    <div className="monitor">
      {status.alarm && (
        <p className="alarm" role="alert">
          No gaze sample for {status.lastSampleAgeMs === null ? 'any time yet' : `${(status.lastSampleAgeMs / 1000).toFixed(1)} s`}: check the tracker and its connection.
        </p>
      )}
      <dl className="facts">
        <dt>Gaze source</dt>
        <dd>
          {status.source ? `${status.source.description}${status.source.connected ? '' : ' (not connected)'}` : 'none'}
        </dd>
        <dt>Sample rate</dt>
        <dd>
          {fixed(status.measuredRateHz, 0, 'Hz')}
          {status.source?.nominalRateHz ? ` (nominal ${status.source.nominalRateHz} Hz)` : ''}
        </dd>
        <dt>Data loss, last 10 s</dt>
        <dd>{fixed(status.dataLossPct10s, 1, '%')}</dd>
        <dt>Tracker clock offset</dt>
        <dd>
          {fixed(status.clockOffsetS, 4, 's')} {status.clockUncertaintyMs !== null && `± ${status.clockUncertaintyMs.toFixed(3)} ms`}
        </dd>
        <dt>Stage clock</dt>
        <dd>{status.stageClockUncertaintyMs === null ? 'not synchronised' : `± ${status.stageClockUncertaintyMs.toFixed(3)} ms`}</dd>
        <dt>Frames late</dt>
        <dd>
          {status.framesLate} of {status.framesTotal}
          {lateShare !== null && ` (${lateShare.toFixed(2)} %)`}
        </dd>
        {status.clipFrames && (
          <>
            <dt>This clip</dt>
            <dd>
              {status.clipFrames.frames} frames, {status.clipFrames.late} late; stage draw time p50 {status.clipFrames.drawMsP50?.toFixed(1) ?? '–'} ms, p99{' '}
              {status.clipFrames.drawMsP99?.toFixed(1) ?? '–'} ms
            </dd>
          </>
        )}
        <dt>Garbage lines</dt>
        <dd>{status.garbageLines}</dd>
        {status.recording && (
          <>
            <dt>Recording</dt>
            <dd>
              {status.recording.sessionId}: {status.recording.samples.toLocaleString('en-GB')} samples, {status.recording.frames.toLocaleString('en-GB')} frames
            </dd>
          </>
        )}
      </dl>
    </div>
  );
}
