import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { minimumCurvature, tvdAtMd } from '../../../src-renderer/engine/analysis/survey';
import { isSurveyFile, parseSurveyFile } from '../../../src-renderer/engine/import/survey-import';
import { thrown } from '../../support/errors';
import { groupBy, readReferenceRows } from '../../support/reference';

const encode = (text: string) => new TextEncoder().encode(text);
/** International foot, m (exact; NIST SP 811 appendix B). */
const FOOT = 0.3048;

function readRows(file: string): Record<string, string>[] {
  return readReferenceRows('directional', file);
}

describe('survey import', () => {
  it('should read the Harrow Flats HF-3 demonstration survey and give the build-and-hold TVD', () => {
    const survey = parseSurveyFile(readFileSync('demo/HF-3_survey.csv'), 'HF-3_survey.csv');
    expect(survey.well).toBe('HF-3');
    expect(survey.depthUnit).toBe('m');
    expect(survey.stations).toHaveLength(134);
    expect(survey.stations[0]).toEqual({ md: 0, inc: 0, azi: 0 });
    expect(survey.stations[survey.stations.length - 1]).toEqual({ md: 3990, inc: 35, azi: 62 });
    // The demo profile (demo/manifest.json): vertical to 800 m, build 2 deg/30 m to 35 deg, hold.
    // A constant build is a circular arc of radius R = 30 m / (2 deg in rad); TVD at the end of
    // the build is KOP + R sin(35 deg), then TVD grows by cos(35 deg) per metre of hold
    // (build-and-hold geometry, Bourgoyne et al., Applied Drilling Engineering, 1986, ch. 8; from memory).
    const radius = 30 / ((2 * Math.PI) / 180);
    const path = minimumCurvature(survey.stations);
    const at = (md: number) => path.find((p) => p.md === md)!;
    // Stations inside the build lie on the arc: TVD = KOP + R sin(inc). The listing rounds
    // angles to 0.01 deg and the kick-off falls between stations, hence 0.01 m.
    expect(Math.abs(at(1320).tvd - (800 + radius * Math.sin(((1320 - 800) / 15) * (Math.PI / 180))))).toBeLessThan(0.01);
    // Along the 35 deg hold TVD grows by cos(35 deg) per metre of MD.
    expect(at(3990).tvd - at(1350).tvd).toBeCloseTo((3990 - 1350) * Math.cos((35 * Math.PI) / 180), 6);
    expect(tvdAtMd(path, 780)).toBeCloseTo(780, 9);
  });

  // ISCWSA, "Standard set of well paths for use in evaluating clearance calculations", r4, May 2017:
  // TVD listed to 0.01 m. Each well is written here as a semicolon file with decimal commas, MD in
  // feet (converted with the exact international foot) and a metadata block naming the well.
  it('should reproduce the ISCWSA clearance well TVDs within 0.01 m from semicolon, decimal-comma, feet files', () => {
    const wells = groupBy(readRows('iscwsa_clearance_wellpaths_r4.csv'), (r) => r.well_id);
    expect(wells.size).toBe(12);
    let worst = 0;
    for (const [id, rows] of wells) {
      const text = [
        `Well;ISCWSA ${id}`,
        'Field;Harrow Flats reference copy',
        '',
        'MD (ft);Inclination (deg);Azimuth (deg)',
        ...rows.map((r) => [(Number(r.md_m) / FOOT).toFixed(6), r.inc_deg, r.azi_deg_grid].map((v) => v.replace('.', ',')).join(';')),
      ].join('\r\n');
      const survey = parseSurveyFile(encode(text), `iscwsa-${id}.txt`);
      expect(survey.well).toBe(`ISCWSA ${id}`);
      expect(survey.depthUnit).toBe('ft');
      expect(survey.stations).toHaveLength(rows.length);
      const first = rows[0];
      const path = minimumCurvature(survey.stations, { tvd: Number(first.tvd_m), north: Number(first.north_m), east: Number(first.east_m) });
      rows.forEach((r, i) => { worst = Math.max(worst, Math.abs(path[i].tvd - Number(r.tvd_m))); });
    }
    expect(worst).toBeLessThan(0.01);
  });

  // ISCWSA MWD error-model example spreadsheet Rev 5, test well #1 (SPE 67616): MD m, Inc, Az, TVD.
  it('should read ISCWSA test well 1 from a tab-separated file with a units row and from LAS, TVD within 0.01 m', () => {
    const rows = readRows('iscwsa_test_wells_1_2_3_wellpath.csv').filter((r) => r.well === 'ISCWSA#1');
    expect(rows).toHaveLength(268);
    const tab = ['# Well: ISCWSA#1', 'Measured depth\tInclination\tAzimuth', 'm\tdeg\tdeg', ...rows.map((r) => `${r.md}\t${r.inc_deg}\t${r.azi_deg_true}`)].join('\n');
    const las = [
      '~VERSION INFORMATION', ' VERS.   2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0', ' WRAP.   NO  : ONE LINE PER STEP',
      '~WELL INFORMATION', ` STRT.M ${rows[0].md} : START DEPTH`, ` STOP.M ${rows[rows.length - 1].md} : STOP DEPTH`, ' STEP.M 0 : STEP',
      ' NULL. -999.25 : NULL VALUE', ' WELL. ISCWSA#1 : WELL',
      '~CURVE INFORMATION', ' DEPT.M : MEASURED DEPTH', ' INC.DEG : INCLINATION', ' AZI.DEG : AZIMUTH',
      '~A', ...rows.map((r) => `${r.md} ${r.inc_deg} ${r.azi_deg_true}`),
    ].join('\n');
    for (const [name, text] of [['iscwsa-1.txt', tab], ['iscwsa-1.las', las]]) {
      const survey = parseSurveyFile(encode(text), name);
      expect(survey.well).toBe('ISCWSA#1');
      const path = minimumCurvature(survey.stations);
      rows.forEach((r, i) => expect(Math.abs(path[i].tvd - Number(r.tvd)), `${name} MD ${r.md}`).toBeLessThan(0.01));
    }
    expect(isSurveyFile(encode(las), 'iscwsa-1.las')).toBe(true);
    expect(isSurveyFile(encode(tab), 'iscwsa-1.txt')).toBe(true);
  });

  it('should name file, line and column when MD does not increase (bad-survey from the survey validation)', () => {
    const text = 'Well,HF-3\n\nMD (m),Inclination (deg),Azimuth (deg)\n0,0,0\n30,1,10\n30,2,10\n60,3,10\n';
    const e = thrown(() => parseSurveyFile(encode(text), 'bad.csv'));
    expect(e.code).toBe('bad-survey');
    expect(e.location).toEqual({ file: 'bad.csv', line: 6, column: 1 });
    expect(e.message).toMatch(/does not increase/);
  });

  it('should point at the inclination column for an inclination outside 0-180 degrees', () => {
    const e = thrown(() => parseSurveyFile(encode('MD (m)\tInc (deg)\tAzi (deg)\n0\t0\t0\n30\t190\t0\n'), 'inc.txt'));
    expect(e.code).toBe('bad-survey');
    expect(e.location).toEqual({ file: 'inc.txt', line: 3, column: 2 });
  });

  it('should reject a non-numeric cell, an MD without a unit, a missing header and a LAS without azimuth', () => {
    const cell = thrown(() => parseSurveyFile(encode('MD (m),Inc (deg),Azi (deg)\n0,0,0\n30,x,0\n'), 'cell.csv'));
    expect(cell.code).toBe('non-numeric-cell');
    expect(cell.location).toEqual({ file: 'cell.csv', line: 3, column: 2 });
    const unit = thrown(() => parseSurveyFile(encode('MD,Inc,Azi\n0,0,0\n30,1,0\n'), 'unit.csv'));
    expect(unit.code).toBe('unknown-unit');
    expect(unit.location).toEqual({ file: 'unit.csv', line: 1, column: 1 });
    expect(thrown(() => parseSurveyFile(encode('Time (s),Pressure (psi)\n0,1\n1,2\n'), 'test.csv')).code).toBe('empty-table');
    expect(isSurveyFile(encode('Time (s),Pressure (psi)\n0,1\n1,2\n'), 'test.csv')).toBe(false);
    const las = '~V\n VERS. 2.0 :\n WRAP. NO :\n~W\n NULL. -999.25 :\n~C\n DEPT.M : DEPTH\n INC.DEG : INCLINATION\n~A\n0 0\n30 1\n';
    expect(thrown(() => parseSurveyFile(encode(las), 'noazi.las')).code).toBe('bad-survey');
    expect(isSurveyFile(encode(las), 'noazi.las')).toBe(false);
    expect(thrown(() => parseSurveyFile(encode('MD (m),Inc (deg),Azi (deg)\n0,0,0\n'), 'one.csv')).code).toBe('too-few-points');
  });
});
