import { LOG_INTERVAL_MS, LOG_MIN_FILES, ProgressReporter, TTY_INTERVAL_MS } from './ProgressReporter';
import { MemoryStream } from './fixtures/memoryStream';

function reporter(isTTY: boolean) {
  const stream = new MemoryStream();
  let time = 0;
  const progress = new ProgressReporter({ stream, isTTY, now: () => time });
  return { stream, progress, advance: (ms: number) => (time += ms) };
}

describe('ProgressReporter', () => {
  it('should draw the bar with grouped counts and the percentage', () => {
    expect(ProgressReporter.barLine({ phase: 'analyse', done: 1234, total: 5678 })).toBe(
      'analysing 1,234/5,678 files ▕████░░░░░░░░░░░░░░░░▏ 21%',
    );
    expect(ProgressReporter.barLine({ phase: 'analyse', done: 0, total: 0 })).toMatch(/0\/0 files ▕░{20}▏ 0%$/);
    expect(ProgressReporter.barLine({ phase: 'discover', done: 40, total: 40 })).toBe('finding files… 40');
  });

  it('should redraw a terminal line at most ten times a second, and always at the end', () => {
    const { stream, progress, advance } = reporter(true);
    for (let done = 1; done <= 1000; done++) {
      progress.update({ phase: 'analyse', done, total: 1000 });
      advance(1); // 1,000 files in one second
    }
    const draws = stream.text.split('\r').filter((s) => s.startsWith('analysing'));
    expect(draws.length).toBeLessThanOrEqual(1000 / TTY_INTERVAL_MS + 2);
    expect(draws.length).toBeGreaterThanOrEqual(5);
    expect(draws[draws.length - 1]).toMatch(/^analysing 1,000\/1,000 files .* 100%/);
    progress.finish();
    expect(stream.text.endsWith('\r\x1b[K')).toBe(true);
    expect(stream.text).not.toContain('\n');
  });

  it('should print nothing off a terminal for a small scan', () => {
    const { stream, progress, advance } = reporter(false);
    for (let done = 1; done <= LOG_MIN_FILES; done++) {
      progress.update({ phase: 'analyse', done, total: LOG_MIN_FILES });
      advance(100);
    }
    progress.finish();
    expect(stream.text).toBe('');
  });

  it('should print a plain line at most every two seconds off a terminal for a large scan', () => {
    const { stream, progress, advance } = reporter(false);
    const total = 5000;
    for (let done = 1; done <= total; done++) {
      progress.update({ phase: 'analyse', done, total });
      advance(2); // ten seconds in all
    }
    progress.finish();
    const lines = stream.text.trimEnd().split('\n');
    expect(lines.length).toBeLessThanOrEqual((total * 2) / LOG_INTERVAL_MS + 1);
    expect(lines.length).toBeGreaterThanOrEqual(4);
    expect(lines[0]).toBe('analysing 1/5,000 files (0%)');
    expect(stream.text).not.toMatch(/[\r\x1b]/);
  });
});
