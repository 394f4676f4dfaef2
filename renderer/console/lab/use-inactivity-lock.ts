import { useEffect } from 'react';

const activity = ['keydown', 'pointerdown', 'pointermove', 'wheel', 'touchstart'] as const;

/** Calls `lock` after `minutes` without keyboard, pointer or touch input, while `active`. */
export function useInactivityLock(active: boolean, minutes: number, lock: () => void): void {
  useEffect(() => {
    if (!active) return;
    let timer = setTimeout(lock, minutes * 60_000);
    const restart = () => {
      clearTimeout(timer);
      timer = setTimeout(lock, minutes * 60_000);
    };
    for (const type of activity) window.addEventListener(type, restart, { passive: true, capture: true });
    return () => {
      clearTimeout(timer);
      for (const type of activity) window.removeEventListener(type, restart, { capture: true });
    };
  }, [active, minutes, lock]);
}
