import { FirstRunPanel } from './FirstRunPanel';
import { HostPanel } from './HostPanel';
import { StagePanel } from './StagePanel';

export function Overview() {
  return (
    <main className="overview" aria-label="Overview">
      <HostPanel />
      <StagePanel />
      <FirstRunPanel />
    </main>
  );
}
