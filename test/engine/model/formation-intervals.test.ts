import { describe, expect, it } from 'vitest';
import { fitShminTrend, shminTrendAt, UNNAMED_FORMATION } from '../../../src-renderer/engine/model/shmin-trend';
import { intervalsFromFormations } from '../../../src-renderer/engine/model/trend-intervals';

// Synthetic Harrow Flats tests with invented formations; truth set here:
// Ashgrove Shale Shmin = 1 MPa + 16.5 kPa/m x TVD, Millrace Sandstone 4 MPa + 15 kPa/m x TVD (exact, no scatter).

describe('formation intervals', () => {
  it('should order formations by depth and meet midway between neighbouring tests', () => {
    const { intervals, notes } = intervalsFromFormations([
      { formation: 'Millrace Sandstone', tvd: 1900 }, { formation: 'Ashgrove Shale', tvd: 900 }, { formation: ' ashgrove shale ', tvd: 1300 },
      { formation: 'Millrace Sandstone', tvd: 2500 }, { tvd: null, formation: 'Corbel Limestone' },
    ]);
    // (1300 + 1900) / 2 = 1600 m; names as first written, case and blanks ignored.
    expect(intervals).toEqual([{ name: 'Ashgrove Shale', top: 0, base: 1600 }, { name: 'Millrace Sandstone', top: 1600, base: Infinity }]);
    expect(notes[0]).toMatch(/Ashgrove Shale: 2 tests, Millrace Sandstone: 2 tests/);
  });

  it('should group tests without a name as "unnamed" and state overlapping formations', () => {
    const { intervals, notes } = intervalsFromFormations([
      { tvd: 1000 }, { formation: 'Ashgrove Shale', tvd: 1200 }, { formation: 'Ashgrove Shale', tvd: 2000 }, { formation: 'Millrace Sandstone', tvd: 1800 },
    ]);
    expect(intervals.map((i) => i.name)).toEqual([UNNAMED_FORMATION, 'Ashgrove Shale', 'Millrace Sandstone']);
    for (let i = 1; i < intervals.length; i++) expect(intervals[i].top).toBe(intervals[i - 1].base);
    expect(intervals.every((i) => i.base > i.top)).toBe(true);
    expect(notes.join(' ')).toMatch(/1 test carries no formation name/);
    expect(notes.join(' ')).toMatch(/overlap in depth/);
  });

  it('should fit each formation its own exact line by name', () => {
    const line = (a: number, g: number) => (z: number) => a + g * z;
    const shale = line(1e6, 16_500);
    const sand = line(4e6, 15_000);
    const pts = [
      ...[800, 1000, 1200, 1400].map((z) => ({ id: `s${z}`, tvd: z, shmin: shale(z), kind: 'estimate' as const, grade: 'A' as const, formation: 'Ashgrove Shale' })),
      ...[1900, 2200, 2500].map((z) => ({ id: `m${z}`, tvd: z, shmin: sand(z), kind: 'estimate' as const, grade: 'B' as const, formation: 'Millrace Sandstone' })),
      { id: 'u', tvd: 1600, shmin: shale(1600), kind: 'estimate' as const, grade: 'A' as const },
    ];
    const { intervals } = intervalsFromFormations(pts);
    const trend = fitShminTrend(pts, { shape: { kind: 'intervals', assignBy: 'formation', intervals } });
    expect(trend.segments.map((s) => s.name)).toEqual(['Ashgrove Shale', 'Millrace Sandstone']);
    expect(trend.segments[0].gradient).toBeCloseTo(16_500, 6);
    expect(trend.segments[1].intercept).toBeCloseTo(4e6, 3);
    // The unnamed test is in its own group, too small for a line (needs three tests), and says so.
    expect(trend.points.find((p) => p.id === 'u')!.reason).toMatch(/too few tests to fit unnamed/);
    expect(shminTrendAt(trend, 2000)!.segment).toBe('Millrace Sandstone');
    expect(shminTrendAt(trend, 2000)!.estimate).toBeCloseTo(sand(2000), 3);
  });
});
