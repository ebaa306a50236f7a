import { gravityModule, trend } from './gravity-fixtures';
import { describeTrend, isNewModule, sparklineGeometry, trendChange } from './gravity-trend';

describe('sparklineGeometry', () => {
  const box = { width: 100, height: 24, padding: 2 };

  it('should spread snapshots evenly and span the values from bottom to top', () => {
    const geometry = sparklineGeometry(trend([0, 50], 100), box);

    expect(geometry.baseline).toBe(22);
    expect(geometry.top).toBe(2);
    expect([geometry.low, geometry.high]).toEqual([0, 100]);
    expect(geometry.points).toEqual([
      { x: 2, y: 22, gravity: 0, isCurrent: false },
      { x: 50, y: 12, gravity: 50, isCurrent: false },
      { x: 98, y: 2, gravity: 100, isCurrent: true },
    ]);
    expect(geometry.paths).toEqual(['M2,22 L50,12 L98,2']);
  });

  it('should break the line where the module was absent and draw no line for a lone point', () => {
    const geometry = sparklineGeometry(trend([40, null, 30], 30), box);

    expect(geometry.points.map((p) => p.x)).toEqual([2, 66, 98]);
    // 30–40 is narrower than 20 points: drawn as 25–45 around its middle.
    expect([geometry.low, geometry.high]).toEqual([25, 45]);
    expect(geometry.points.map((p) => p.y)).toEqual([7, 17, 17]);
    // 40 stands alone before the gap: a dot, no path; 30 → 30 is one flat run.
    expect(geometry.paths).toEqual(['M66,17 L98,17']);
  });

  it('should draw a wide change across the full height and keep a narrow range inside 0–100', () => {
    expect(sparklineGeometry(trend([50], 80), box).points.map((p) => p.y)).toEqual([22, 2]);
    expect(sparklineGeometry(trend([61.2], 79.5), box).points.map((p) => p.y)).toEqual([21.15, 2.85]);
    const low = sparklineGeometry(trend([2], 4), box);
    expect([low.low, low.high]).toEqual([0, 20]);
    expect(low.points.map((p) => p.y)).toEqual([20, 18]);
    const high = sparklineGeometry(trend([99], 97), box);
    expect([high.low, high.high]).toEqual([80, 100]);
  });

  it('should keep values outside 0–100 inside the box', () => {
    const geometry = sparklineGeometry(trend([-5], 120), box);

    expect(geometry.points.map((p) => p.y)).toEqual([22, 2]);
    expect(geometry.points.map((p) => p.gravity)).toEqual([-5, 120]);
  });

  it('should place a single snapshot at the left edge', () => {
    const geometry = sparklineGeometry(gravityModule().trend, box);

    expect(geometry.points).toEqual([{ x: 2, y: 12, gravity: 79.5, isCurrent: true }]);
    expect(geometry.paths).toEqual([]);
  });
});

describe('describeTrend', () => {
  it('should say nothing with a single snapshot', () => {
    expect(describeTrend(trend([], 52))).toBeNull();
  });

  it('should say how gravity rose or fell from the earliest snapshot with the module', () => {
    expect(describeTrend(trend([48.1, 50], 52))).toBe('Gravity rose from 48.1 to 52 over 3 snapshots');
    expect(describeTrend(trend([61.25], 40))).toBe('Gravity fell from 61.3 to 40 over 2 snapshots');
    expect(describeTrend(trend([null, 30], 35.5))).toBe('Gravity rose from 30 to 35.5 over 3 snapshots, absent from 1 of them');
  });

  it('should say when gravity did not change', () => {
    expect(describeTrend(trend([20.01], 20))).toBe('Gravity unchanged at 20 over 2 snapshots');
  });

  it('should say when the module is new in this snapshot', () => {
    expect(describeTrend(trend([null], 52))).toBe('Gravity 52; the module is not in the 1 earlier snapshot');
    expect(describeTrend(trend([null, null], 9))).toBe('Gravity 9; the module is not in the 2 earlier snapshots');
  });
});

describe('trendChange', () => {
  it('should give the signed change since the earliest snapshot with the module', () => {
    expect(trendChange(trend([48.1], 52))).toBe('+3.9');
    expect(trendChange(trend([null, 60], 52))).toBe('−8');
    expect(trendChange(trend([52], 52))).toBe('±0');
  });

  it('should give nothing for a module new in this snapshot or for a single snapshot', () => {
    expect(trendChange(trend([null], 52))).toBeNull();
    expect(trendChange(trend([], 52))).toBeNull();
  });
});

describe('isNewModule', () => {
  it('should tell a module that no earlier snapshot has', () => {
    expect(isNewModule(trend([null, null], 52))).toBe(true);
    expect(isNewModule(trend([null, 40], 52))).toBe(false);
    expect(isNewModule(trend([], 52))).toBe(false);
  });
});
