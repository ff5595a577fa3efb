import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { measuredDepthAtTvd, trueVerticalDepthAtMd, wellPathFromSurvey } from '../../../src-renderer/engine/model/well-path';
import { readReferenceRows } from '../../support/reference';

function wellRows(name: string): { md: number; inc: number; azi: number; tvd: number }[] {
  return readReferenceRows('directional', 'iscwsa_test_wells_1_2_3_wellpath.csv')
    .filter((r) => r.well === name)
    .map((r) => ({ md: Number(r.md), inc: Number(r.inc_deg), azi: Number(r.azi_deg_true), tvd: Number(r.tvd) }));
}

describe('well path', () => {
  // ISCWSA MWD error-model example spreadsheet Rev 5, test well #1 (SPE 67616): MD and TVD in m,
  // TVD listed to 0.01 m. MD at the published TVD must give back the station MD: the error is
  // the TVD rounding divided by cos(inclination), so stations up to 60 degrees are checked to 0.02 m.
  it('should give the MD of ISCWSA test well 1 at its published TVDs', () => {
    const rows = wellRows('ISCWSA#1');
    const well = wellPathFromSurvey('ISCWSA#1', rows);
    const checked = rows.filter((r) => r.inc <= 60 && r.md > 0);
    expect(checked.length).toBeGreaterThan(100);
    for (const r of checked) expect(Math.abs(measuredDepthAtTvd(well, r.tvd)! - r.md), `MD ${r.md}`).toBeLessThan(0.02);
    for (const r of rows) expect(Math.abs(trueVerticalDepthAtMd(well, r.md) - r.tvd), `MD ${r.md}`).toBeLessThan(0.01);
    expect(well.provenance).toMatch(/minimum curvature/);
  });

  it('should hold the well vertical above the first station and its last direction below the last', () => {
    // Synthetic Harrow Flats path, truth set here: stations from 500 m MD, straight 30 deg hold below.
    const well = wellPathFromSurvey('HF-3', [{ md: 500, inc: 30, azi: 62 }, { md: 1000, inc: 30, azi: 62 }]);
    expect(trueVerticalDepthAtMd(well, 200)).toBeCloseTo(200, 9);
    expect(trueVerticalDepthAtMd(well, 1000)).toBeCloseTo(500 + 500 * Math.cos(Math.PI / 6), 9);
    expect(trueVerticalDepthAtMd(well, 1200)).toBeCloseTo(500 + 700 * Math.cos(Math.PI / 6), 9);
    expect(measuredDepthAtTvd(well, 5000)).toBeNull();
    expect(() => wellPathFromSurvey('HF-3', [{ md: 0, inc: 0, azi: 0 }])).toThrow(EngineError);
  });
});
