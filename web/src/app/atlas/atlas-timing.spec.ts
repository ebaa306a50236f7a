import { markAtlas, markFirstFrame } from './atlas-timing';

describe('atlas timing marks', () => {
  let marks: string[];
  let original: Performance['mark'] | undefined;

  beforeEach(() => {
    marks = [];
    original = performance.mark;
    // jsdom's performance object has no User Timing: record what would be marked.
    performance.mark = ((name: string) => void marks.push(name)) as Performance['mark'];
  });
  afterEach(() => {
    performance.mark = original as Performance['mark'];
    jest.useRealTimers();
  });

  it('should record User Timing marks under the seamline:atlas: prefix', () => {
    markAtlas('layout-start');
    expect(marks).toEqual(['seamline:atlas:layout-start']);
  });

  it('should mark the first frame only after the browser has painted', () => {
    jest.useFakeTimers({ doNotFake: ['performance'] });
    const frames: FrameRequestCallback[] = [];
    const raf = jest.spyOn(window, 'requestAnimationFrame').mockImplementation((callback) => frames.push(callback));
    markFirstFrame();
    expect(marks).toEqual([]);
    frames[0](0);
    expect(marks).toEqual([]);
    jest.runAllTimers();
    expect(marks).toEqual(['seamline:atlas:first-frame']);
    raf.mockRestore();
  });
});
