import type { ReactNode } from 'react';
import { useLabState } from './lab-context';
import { SetUpScreen } from './SetUpScreen';

/**
 * Screens that read no lab records and show no personal data work before the lab is set
 * up; every other screen (including ones added later) needs it, so they get the set-up
 * screen until there is a lab.
 */
const screensWithoutLab: ReadonlySet<string> = new Set(['overview', 'stimuli', 'live']);

export function LabGate({ screen, children }: { screen: string; children: ReactNode }) {
  const lab = useLabState();
  if (screensWithoutLab.has(screen)) return children;
  if (lab.phase === 'failed')
    return (
      <main className="lab-setup">
        <p className="failure" role="alert">
          {lab.failure}
        </p>
      </main>
    );
  if (lab.phase === 'opening')
    return (
      <main className="lab-setup">
        <p className="muted">Opening the lab database…</p>
      </main>
    );
  if (lab.phase === 'setup') return <SetUpScreen />;
  return children;
}
