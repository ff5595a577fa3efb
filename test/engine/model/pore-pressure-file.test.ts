import { describe, expect, it } from 'vitest';
import { parsePorePressureFile, pointsOfWell } from '../../../src-renderer/engine/model/pore-pressure-file';
import { porePressureAt, porePressureFromMeasurements } from '../../../src-renderer/engine/model/pore-pressure';
import { thrown } from '../../support/errors';

const encode = (text: string) => new TextEncoder().encode(text);
/** NIST SP 811 appendix B: foot = 0.3048 m, psi = 6894.757293168 Pa; standard gravity 9.80665 m/s2. */
const FOOT = 0.3048;
const PSI = 6894.757293168361;
const G = 9.80665;

describe('pore-pressure file', () => {
  it('should read feet and psi under a metadata block naming the well, with decimal commas', () => {
    // Harrow Flats HF-4 formation-tester points, truth set here.
    const text = 'Well;HF-4\nContractor;Cobalt Ridge Test Services\n\nTVD (ft);Pore pressure (psi);Source\n4000;1800,5;tester\n8000;4100;tester\n';
    const points = parsePorePressureFile(encode(text), 'hf4-pp.txt');
    expect(points).toHaveLength(2);
    expect(points[0]).toMatchObject({ well: 'HF-4', line: 5, source: 'tester' });
    expect(points[0].tvd).toBeCloseTo(4000 * FOOT, 9);
    expect(points[0].pressure).toBeCloseTo(1800.5 * PSI, 6);
    expect(points[1].pressure).toBeCloseTo(4100 * PSI, 6);
  });

  it('should turn an equivalent mud weight or a gradient into a pressure at the point TVD', () => {
    // Hydrostatics: P = rho g TVD; 1.2 sg = 1200 kg/m3 (specific gravity to water at 1000 kg/m3, common practice).
    const emw = parsePorePressureFile(encode('TVD (m),Pp EMW (sg)\n1000,1.2\n2000,1.3\n'), 'emw.csv');
    expect(emw[0].pressure).toBeCloseTo(1200 * G * 1000, 3);
    expect(emw[1].pressure).toBeCloseTo(1300 * G * 2000, 3);
    const gradient = parsePorePressureFile(encode('TVD (m)\tPp (kPa/m)\n1500\t11\n'), 'grad.txt');
    expect(gradient[0].pressure).toBeCloseTo(11_000 * 1500, 6);
  });

  it('should keep the well of each row and choose the points of one well', () => {
    const text = 'Well,TVD (m),Pp (MPa)\nHF-1,1000,10.5\nHF-1,2000,23\nHF-2,1500,15.2\n';
    const points = parsePorePressureFile(encode(text), 'pp.csv');
    const chosen = pointsOfWell(points, 'HF-1', 'pp.csv');
    expect(chosen.points.map((p) => p.tvd)).toEqual([1000, 2000]);
    // Straight lines between the points and zero at the rig floor (pore-pressure.ts); truth set here.
    const profile = porePressureFromMeasurements(chosen.points, { well: chosen.well });
    expect(porePressureAt(profile, 1500)).toBeCloseTo(16.75e6, 3);
    expect(thrown(() => pointsOfWell(points, undefined, 'pp.csv')).code).toBe('bad-argument');
    expect(thrown(() => pointsOfWell(points, 'HF-9', 'pp.csv')).code).toBe('bad-argument');
  });

  it('should name file, line and column for a missing unit, a non-numeric cell and a depth above the rig floor', () => {
    const unit = thrown(() => parsePorePressureFile(encode('TVD (m),Pp\n1000,10\n'), 'a.csv'));
    expect(unit.code).toBe('unknown-unit');
    expect(unit.location).toEqual({ file: 'a.csv', line: 1, column: 2 });
    const cell = thrown(() => parsePorePressureFile(encode('TVD (m),Pp (MPa)\n1000,10\n2000,abc\n'), 'b.csv'));
    expect(cell.code).toBe('non-numeric-cell');
    expect(cell.location).toEqual({ file: 'b.csv', line: 3, column: 2 });
    const depth = thrown(() => parsePorePressureFile(encode('TVD (m),Pp (MPa)\n-5,10\n'), 'c.csv'));
    expect(depth.code).toBe('out-of-range');
    expect(depth.location).toEqual({ file: 'c.csv', line: 2, column: 1 });
    expect(thrown(() => parsePorePressureFile(encode('Time (s),Pressure (psi)\n0,1\n'), 'd.csv')).code).toBe('empty-table');
  });
});
