import { useEffect } from 'react';
import type { RunnerAction, RunnerPhase } from '../../../app/core/study/session-runner';
import { useLiveStatus } from '../live/use-live-status';

/**
 * The stage blank as the session sees it: while the stage is blank the running step is
 * paused (the host has already paused the clip and cancelled any targets), and it cannot be
 * resumed until the blank ends.
 */
export function useBlankPause(phase: RunnerPhase, dispatch: (action: RunnerAction) => void) {
  const blank = useLiveStatus()?.blank ?? null;
  useEffect(() => {
    if (blank && phase === 'running') dispatch({ type: 'pause' });
  }, [blank, phase, dispatch]);
  return blank;
}
