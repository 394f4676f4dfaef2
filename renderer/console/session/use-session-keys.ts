import { useEffect, useRef } from 'react';
import { commandForKey, type SessionCommand } from './key-map';

const isTextField = (target: EventTarget | null): boolean =>
  target instanceof HTMLElement && (target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName));

/** Sends the session console's keys (key-map.ts) to `onCommand` while `enabled`. */
export function useSessionKeys(enabled: boolean, onCommand: (command: SessionCommand) => void): void {
  const handler = useRef(onCommand);
  handler.current = onCommand;
  useEffect(() => {
    if (!enabled) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.altKey || event.ctrlKey || event.metaKey || event.repeat) return;
      // Enter and Space on a focused button or link press that button, as everywhere.
      if ((event.key === 'Enter' || event.key === ' ') && event.target instanceof HTMLElement && event.target.closest('button, a[href]')) return;
      const command = commandForKey(event.key, isTextField(event.target));
      if (!command) return;
      event.preventDefault();
      handler.current(command);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [enabled]);
}
