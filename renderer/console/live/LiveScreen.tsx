import { MonitorFigures } from './MonitorFigures';
import { PlaybackControls } from './PlaybackControls';
import { RecordingControls } from './RecordingControls';
import { RecoveredSessions } from './RecoveredSessions';
import { TargetCheck } from './TargetCheck';
import { TestPatternControls } from './TestPatternControls';
import { StageMirror } from './StageMirror';
import { useLiveStatus } from './use-live-status';

/** Record gaze while clips play on the stage, and watch the data quality as it happens. */
export function LiveScreen() {
  const status = useLiveStatus();
  return (
    <main className="live" aria-label="Live recording">
      <div className="live-controls">
        <RecoveredSessions recording={status?.recording != null} />
        <RecordingControls status={status} />
        <PlaybackControls status={status} />
        <TargetCheck status={status} />
        <TestPatternControls />
      </div>
      <section className="panel live-monitor" aria-labelledby="monitor-heading">
        <h2 id="monitor-heading">Live</h2>
        <StageMirror status={status} />
        <MonitorFigures status={status} />
      </section>
    </main>
  );
}
