import { useHost } from './host-context';
import { JobsTray } from './jobs/JobsTray';
import { LiveScreen } from './live/LiveScreen';
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
      </header>
      {screen === 'overview' && <Overview />}
      {screen === 'stimuli' && <StimulusLibrary />}
      {screen === 'live' && <LiveScreen />}
      <JobsTray />
    </div>
  );
}
