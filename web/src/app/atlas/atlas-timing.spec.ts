import { afterNextPaint, markAtlas } from './atlas-timing';

describe('atlas timing marks', () => {
  let marks: string[];
  let original: Performance['mark'] | undefined;

  beforeEach(() => {
    marks = [];
    original = performance.mark;
    // jsdom's performance object has no User Timing: record what would be marked.
    performance.mark = ((name: string) => void marks.push(name)) as unknown as Performance['mark'];
  });
  afterEach(() => {
    performance.mark = original as Performance['mark'];
    jest.useRealTimers();
  });

  it('should record User Timing marks under the seamline:atlas: prefix', () => {
    markAtlas('layout-start');
    expect(marks).toEqual(['seamline:atlas:layout-start']);
  });

  it('should wait for the next frame and the task after it', async () => {
    jest.useFakeTimers();
    const frames: FrameRequestCallback[] = [];
    const raf = jest.spyOn(window, 'requestAnimationFrame').mockImplementation((callback) => frames.push(callback));
    let painted = false;
    const waiting = afterNextPaint().then(() => (painted = true));
    await Promise.resolve();
    expect(painted).toBe(false);
    frames[0](0);
    await Promise.resolve();
    expect(painted).toBe(false);
    jest.runAllTimers();
    await waiting;
    expect(painted).toBe(true);
    raf.mockRestore();
  });
});
