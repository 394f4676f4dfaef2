import type { GazeloomApi } from '../../app/contract';

/** The stage's blank keys: X, or Escape (when the browser lets the page have it). */
export const BLANK_KEYS: readonly string[] = ['x', 'X', 'Escape'];

/**
 * The stage blank: mid-grey over everything. The key blanks the stage at once, on the stage
 * itself, and then asks the host to pause everything and record it (blankStage from the
 * stage page); if the host cannot be reached the stage stays blank and asks again when it
 * reconnects. Only the console ends a blank (the host's setBlank command).
 */
export class StageBlank {
  private blankedNow = false;
  private unreported = false;

  constructor(
    private readonly api: GazeloomApi,
    /** Pauses the clip on the stage before the host's pause arrives. */
    private readonly pauseHere: () => void,
  ) {}

  get blanked(): boolean {
    return this.blankedNow;
  }

  /** Listens for the key on the stage page. */
  listen(target: Window): void {
    target.addEventListener('keydown', (event) => {
      if (event.altKey || event.ctrlKey || event.metaKey || !BLANK_KEYS.includes(event.key)) return;
      event.preventDefault();
      if (!event.repeat) this.byKey(event.key === 'Escape' ? 'Escape' : 'X');
    });
  }

  byKey(key: string): void {
    this.set(true);
    this.pauseHere();
    this.unreported = true;
    this.report(key);
  }

  /** The host's command (the console blanked or unblanked). */
  set(blanked: boolean): void {
    this.blankedNow = blanked;
    if (!blanked) this.unreported = false;
    document.body.dataset.blanked = String(blanked);
  }

  /** The connection is open again: a blank the host has not heard of is reported now. */
  reconnected(): void {
    if (this.unreported) this.report('X');
  }

  private report(key: string): void {
    void this.api.blankStage({ reason: `stage key ${key}` }).then((r) => {
      if (r.ok) this.unreported = false;
    });
  }
}
