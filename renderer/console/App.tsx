import { useHost } from './host-context';
import { ArchiveScreen } from './archive/ArchiveScreen';
import { JobsTray } from './jobs/JobsTray';
import { LabBar } from './lab/LabBar';
import { LabGate } from './lab/LabGate';
import { ParticipantsScreen } from './participants/ParticipantsScreen';
import { ProtocolsScreen } from './protocols/ProtocolsScreen';
import { SessionScreen } from './session/SessionScreen';
import { QualityScreen } from './quality/QualityScreen';
import { StudyScreen } from './study/StudyScreen';
import { LiveScreen } from './live/LiveScreen';
import { StageBlankButton } from './live/StageBlankButton';
import { Overview } from './overview/Overview';
import { StimulusLibrary } from './stimuli/StimulusLibrary';
import { screens, useRoute } from './use-route';

export function App() {
  const { connection } = useHost();
  const [screen, go] = useRoute();
  return (
    <div className="app">
      <header className="app-header">
        <h1>Gazeloom</h1>
        <nav className="screens" aria-label="Screens">
          {screens.map((s) => (
            <a
              key={s.id}
              href={`#/${s.id}`}
              aria-current={screen === s.id ? 'page' : undefined}
              title={`Alt+${s.key}`}
              onClick={(event) => {
                event.preventDefault();
                go(s.id);
              }}
            >
              {s.label}
            </a>
          ))}
        </nav>
        <span className={`connection connection-${connection}`} role="status" aria-live="polite">
          {connection === 'open' ? 'host connected' : connection === 'connecting' ? 'connecting to host…' : 'host disconnected: reconnecting'}
        </span>
        <StageBlankButton />
        <LabBar />
      </header>
      <LabGate screen={screen}>
      {screen === 'overview' && <Overview />}
      {screen === 'stimuli' && <StimulusLibrary />}
      {screen === 'live' && <LiveScreen />}
      {screen === 'study' && <StudyScreen />}
      {screen === 'participants' && <ParticipantsScreen />}
      {screen === 'protocols' && <ProtocolsScreen />}
      {screen === 'session' && <SessionScreen />}
      {screen === 'quality' && <QualityScreen />}
      </LabGate>
      {/* Outside the gate: an empty profile can be restored from a backup before any set-up. */}
      {screen === 'archive' && <ArchiveScreen />}
      <JobsTray />
    </div>
  );
}
