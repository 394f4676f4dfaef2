/**
 * The session console's keys: one list, shown in the console's help panel and printed into
 * the README (keyMapMarkdown), so the two never disagree. Letters are matched without
 * regard to case; keys typed into a text field are left to the field (except Escape).
 */
export type SessionCommand = 'continue' | 'pause' | 'skip' | 'repeatValidation' | 'recalibrate' | 'markBad' | 'blank' | 'note' | 'end' | 'help' | 'close';

export interface KeyBinding {
  readonly command: SessionCommand;
  /** KeyboardEvent.key values that trigger it (letters in lower case). */
  readonly keys: readonly string[];
  /** How the key is written for people. */
  readonly label: string;
  readonly description: string;
}

export const sessionKeyMap: readonly KeyBinding[] = [
  { command: 'continue', keys: ['Enter'], label: 'Enter', description: 'Begin the session once the pre-flight checks pass (or a resumed session); go on after a message screen; continue without recalibrating when prompted' },
  { command: 'pause', keys: [' '], label: 'Space', description: 'Pause or resume: the running step stops (a clip leaves the stage) and starts again from its beginning on resume' },
  { command: 'skip', keys: ['n'], label: 'N', description: 'Skip the current step and go to the next' },
  { command: 'repeatValidation', keys: ['v'], label: 'V', description: 'Repeat the validation (a validation is added right after the current step)' },
  { command: 'recalibrate', keys: ['c'], label: 'C', description: 'Recalibrate (a calibration and a validation are added before the next clip)' },
  { command: 'markBad', keys: ['b'], label: 'B', description: 'Mark the current or last trial bad, with a reason' },
  { command: 'blank', keys: ['x'], label: 'X', description: 'Blank the stage to mid-grey and pause everything at once (recorded), as X or Esc on the stage page and the Blank stage button in the header do; only Unblank stage in the header ends a blank' },
  { command: 'note', keys: ['t'], label: 'T', description: 'Type a timestamped note (stored encrypted)' },
  { command: 'end', keys: ['e'], label: 'E', description: 'End the session early (asks first)' },
  { command: 'help', keys: ['?'], label: '?', description: 'Show or hide this key map' },
  { command: 'close', keys: ['Escape'], label: 'Esc', description: 'Close a dialog without saving' },
];

/** The command a key press asks for, or null. `inTextField`: the focus is in an input, textarea or select. */
export function commandForKey(key: string, inTextField: boolean): SessionCommand | null {
  const k = key.length === 1 ? key.toLowerCase() : key;
  const binding = sessionKeyMap.find((b) => b.keys.includes(k));
  if (!binding) return null;
  if (inTextField && binding.command !== 'close') return null;
  return binding.command;
}

/** The key map as a Markdown table, as the README prints it. */
export function keyMapMarkdown(): string {
  const rows = sessionKeyMap.map((b) => `| ${b.label} | ${b.description} |`);
  return ['| Key | What it does |', '|---|---|', ...rows].join('\n');
}
