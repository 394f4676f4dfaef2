import { useHost } from './host-context';
import { FirstRunPanel } from './overview/FirstRunPanel';
import { HostPanel } from './overview/HostPanel';
import { StagePanel } from './overview/StagePanel';

export function App() {
  const { connection } = useHost();
  return (
    <div className="app">
      <header className="app-header">
        <h1>Gazeloom</h1>
        <span className={`connection connection-${connection}`} role="status" aria-live="polite">
          {connection === 'open' ? 'host connected' : connection === 'connecting' ? 'connecting to host…' : 'host disconnected: reconnecting'}
        </span>
      </header>
      <main className="overview" aria-label="Overview">
        <HostPanel />
        <StagePanel />
        <FirstRunPanel />
      </main>
    </div>
  );
}
