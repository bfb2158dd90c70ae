import { InputError } from '../../contracts/input-error.js';

/** "auto": a redrawn status line on a terminal, periodic plain lines otherwise. */
export type ProgressMode = 'auto' | 'bar' | 'lines' | 'off';

export interface ProgressSnapshot {
  readonly step: number;
  readonly maxSteps: number;
  readonly acceptance: number;
  /** From the latest stopping-rule check, e.g. "tau 31.2". */
  readonly note: string;
  /** Steps the stopping rule expects in all, if it can tell. */
  readonly expectedSteps: number | null;
}

function duration(seconds: number): string {
  if (!Number.isFinite(seconds)) return '?';
  const s = Math.round(seconds);
  if (s < 60) return `${s}s`;
  if (s < 3600) return `${Math.floor(s / 60)}m${String(s % 60).padStart(2, '0')}s`;
  return `${Math.floor(s / 3600)}h${String(Math.floor((s % 3600) / 60)).padStart(2, '0')}m`;
}

/**
 * Progress of a run: step, acceptance, the latest autocorrelation or R-hat
 * note, and an ETA from this session's speed towards the step count the
 * stopping rule expects (capped by maxSteps). Redrawn in place at most
 * 5 times a second on a terminal; one plain line every `everySeconds` otherwise.
 */
export class ProgressDisplay {
  private readonly mode: 'bar' | 'lines' | 'off';
  private readonly startTime = Date.now();
  private startStep = -1;
  private lastDraw = 0;
  private drawn = false;

  constructor(
    mode: ProgressMode,
    private readonly stream: NodeJS.WritableStream & { isTTY?: boolean },
    private readonly everySeconds: number,
  ) {
    if (!['auto', 'bar', 'lines', 'off'].includes(mode)) throw new InputError(`progress must be auto, bar, lines or off, got ${JSON.stringify(mode)}`);
    this.mode = mode === 'auto' ? (stream.isTTY ? 'bar' : 'lines') : mode;
  }

  text(p: ProgressSnapshot): string {
    if (this.startStep < 0) this.startStep = p.step;
    const elapsed = (Date.now() - this.startTime) / 1000;
    const rate = (p.step - this.startStep) / Math.max(elapsed, 1e-9);
    const target = Math.min(p.maxSteps, Math.max(p.step, p.expectedSteps ?? p.maxSteps));
    const eta = rate > 0 ? (target - p.step) / rate : Infinity;
    return `step ${p.step}/${target} | acceptance ${p.acceptance.toFixed(3)} | ${p.note} | ETA ${duration(eta)}`;
  }

  update(p: ProgressSnapshot): void {
    if (this.startStep < 0) this.startStep = p.step;
    if (this.mode === 'off') return;
    const now = Date.now();
    if (this.mode === 'bar' && now - this.lastDraw >= 200) {
      this.stream.write(`\r${this.text(p)}\x1b[K`);
      this.drawn = true;
      this.lastDraw = now;
    } else if (this.mode === 'lines' && now - this.lastDraw >= this.everySeconds * 1000) {
      if (this.lastDraw > 0) this.stream.write(`${this.text(p)}\n`);
      this.lastDraw = now;
    }
  }

  /** Final line: ends the redrawn line on a terminal; plain mode prints the final state. */
  finish(p: ProgressSnapshot, outcome: string): void {
    if (this.mode === 'off') return;
    this.stream.write(`${this.mode === 'bar' && this.drawn ? '\r' : ''}${this.text(p)} | ${outcome}${this.mode === 'bar' ? '\x1b[K' : ''}\n`);
  }
}
