/**
 * Scan progress on stderr
 * =======================
 * On a terminal: one line redrawn in place at most ten times a second
 * (`analysing 1,234/5,678 files ▕████░░░░▏ 22%`), erased before the summary. Not on a terminal
 * (CI logs, redirected stderr): nothing for small scans, and for scans of more than a few
 * hundred files one plain line at most every two seconds, so logs stay short.
 */
import type { Writable } from 'node:stream';
import { formatCount } from './formatCount';

/** The progress events the scanner reports (mirrors ScanProgress of project/scanDirectory). */
export interface ProgressEvent {
  phase: 'discover' | 'analyse' | 'calls';
  done: number;
  total: number;
  file?: string;
}

/** How the reporter writes and how it tells time (tests pass a fake clock). */
export interface ProgressReporterOptions {
  stream: Writable;
  isTTY: boolean;
  now?: () => number;
}

/** Redraw interval on a terminal: about ten times a second. */
export const TTY_INTERVAL_MS = 100;
/** Interval between plain lines when stderr is not a terminal. */
export const LOG_INTERVAL_MS = 2000;
/** Scans of at most this many files print no plain progress lines. */
export const LOG_MIN_FILES = 300;

const BAR_WIDTH = 20;

/** Draws scan progress; call `update` for each event and `finish` before the summary. */
export class ProgressReporter {
  private readonly stream: Writable;
  private readonly isTTY: boolean;
  private readonly now: () => number;
  private lastDraw = Number.NEGATIVE_INFINITY;
  private drawn = false;
  private longScan = false;

  constructor(options: ProgressReporterOptions) {
    this.stream = options.stream;
    this.isTTY = options.isTTY;
    this.now = options.now ?? Date.now;
  }

  /** Record a progress event; draws when the interval has passed (or the phase is complete). */
  update(event: ProgressEvent): void {
    const time = this.now();
    if (this.isTTY) {
      const complete = event.phase === 'analyse' && event.total > 0 && event.done >= event.total;
      if (time - this.lastDraw < TTY_INTERVAL_MS && !complete) return;
      this.lastDraw = time;
      this.drawn = true;
      this.stream.write(`\r${ProgressReporter.barLine(event)}\x1b[K`);
      return;
    }
    if (event.phase === 'calls') {
      // Off a terminal, only long scans say what they are doing.
      if (event.done === 0 && this.longScan) this.stream.write('resolving calls and building the module map…\n');
      return;
    }
    if (event.total > LOG_MIN_FILES) this.longScan = true;
    if (event.phase !== 'analyse' || event.total <= LOG_MIN_FILES) return;
    if (time - this.lastDraw < LOG_INTERVAL_MS) return;
    this.lastDraw = time;
    this.stream.write(`${ProgressReporter.plainLine(event)}\n`);
  }

  /** Erase the terminal line, so the summary starts on a clean line. */
  finish(): void {
    if (this.isTTY && this.drawn) this.stream.write('\r\x1b[K');
    this.drawn = false;
  }

  /** The terminal line for one event. */
  static barLine(event: ProgressEvent): string {
    if (event.phase === 'discover') return `finding files… ${formatCount(event.done)}`;
    if (event.phase === 'calls') return event.done < event.total ? 'resolving calls and building the module map…' : 'module map ready';
    const ratio = event.total > 0 ? Math.min(1, event.done / event.total) : 0;
    const filled = Math.round(ratio * BAR_WIDTH);
    const bar = `▕${'█'.repeat(filled)}${'░'.repeat(BAR_WIDTH - filled)}▏`;
    return `analysing ${formatCount(event.done)}/${formatCount(event.total)} files ${bar} ${Math.floor(ratio * 100)}%`;
  }

  /** The log line for one event. */
  static plainLine(event: ProgressEvent): string {
    const percent = event.total > 0 ? Math.floor((Math.min(1, event.done / event.total)) * 100) : 0;
    return `analysing ${formatCount(event.done)}/${formatCount(event.total)} files (${percent}%)`;
  }
}
