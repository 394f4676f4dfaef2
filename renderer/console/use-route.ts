import { useEffect, useState } from 'react';

export const screens = [
  { id: 'overview', label: 'Overview', key: '1' },
  { id: 'stimuli', label: 'Stimuli', key: '2' },
  { id: 'live', label: 'Live', key: '3' },
  { id: 'study', label: 'Study', key: '4' },
  { id: 'participants', label: 'Participants', key: '5' },
  { id: 'protocols', label: 'Protocols', key: '6' },
  { id: 'session', label: 'Session', key: '7' },
  { id: 'quality', label: 'Quality', key: '9' },
  { id: 'archive', label: 'Backups', key: '8' },
] as const;

export type ScreenId = (typeof screens)[number]['id'];

const fromHash = (): ScreenId => {
  const id = location.hash.replace(/^#\/?/, '');
  return (screens.find((s) => s.id === id)?.id ?? 'overview') as ScreenId;
};

/**
 * The console's screen lives in the URL hash (#/stimuli), so a reload keeps the operator
 * where they were. Alt+1, Alt+2, ... switch screens from the keyboard.
 */
export function useRoute(): [ScreenId, (id: ScreenId) => void] {
  const [screen, setScreen] = useState<ScreenId>(fromHash);
  useEffect(() => {
    const onHash = () => setScreen(fromHash());
    const onKey = (event: KeyboardEvent) => {
      if (!event.altKey || event.ctrlKey || event.metaKey) return;
      const target = screens.find((s) => s.key === event.key);
      if (target) {
        event.preventDefault();
        location.hash = `#/${target.id}`;
      }
    };
    window.addEventListener('hashchange', onHash);
    window.addEventListener('keydown', onKey);
    return () => {
      window.removeEventListener('hashchange', onHash);
      window.removeEventListener('keydown', onKey);
    };
  }, []);
  return [screen, (id) => (location.hash = `#/${id}`)];
}
