/**
 * Per-browser lab preferences (no personal data): the inactivity lock, the chosen study and
 * the last operator, so that a reload or an unlock starts where the operator was.
 */
const LOCK_KEY = 'gazeloom.lab.lockAfterMinutes';
const STUDY_KEY = 'gazeloom.lab.studyId';
const OPERATOR_KEY = 'gazeloom.lab.lastOperatorId';
export const DEFAULT_LOCK_AFTER_MINUTES = 10;

const read = (key: string): string | null => {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
};
const write = (key: string, value: string | null): void => {
  try {
    if (value === null) localStorage.removeItem(key);
    else localStorage.setItem(key, value);
  } catch {
    // Storage refused (private window): the preference lasts until the page closes.
  }
};

export function lockAfterMinutes(): number {
  const value = Number(read(LOCK_KEY));
  return Number.isInteger(value) && value >= 1 && value <= 240 ? value : DEFAULT_LOCK_AFTER_MINUTES;
}
export const saveLockAfterMinutes = (minutes: number) => write(LOCK_KEY, String(minutes));
export const chosenStudyId = () => read(STUDY_KEY);
export const saveChosenStudyId = (id: string | null) => write(STUDY_KEY, id);
export const lastOperatorId = () => read(OPERATOR_KEY);
export const saveLastOperatorId = (id: string) => write(OPERATOR_KEY, id);
