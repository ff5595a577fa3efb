import { describe, expect, it } from 'vitest';
import { recordToDelimited } from '../../../src-renderer/engine/synthetic/delimited-writer';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import { densityLogToLas, recordToLas } from '../../../src-renderer/engine/synthetic/las-writer';

// Unit factors: NIST SP 811 (psi = 6894.757 Pa, bbl = 0.1589873 m3, bar = 1e5 Pa).
const PSI = 6894.757293168361;
const BBL = 0.158987294928;
const { record } = generateSyntheticTest({ type: 'lot', depthTvd: 1500, shmin: 25.75e6, seed: 8, metadata: { well: 'HF-1', date: '2026-03-14' } });

describe('delimited writer', () => {
  it('should write the comma layout with a metadata block and units in the header', () => {
    const lines = recordToDelimited(record, 'comma-psi-bbl').split('\n');
    expect(lines[0]).toBe('Well,HF-1');
    expect(lines).toContain('TVD (ft),4921.3'); // 1500 m / 0.3048 = 4921.26 ft
    const header = lines.indexOf('Elapsed Time (s),Pressure (psi),Rate (bbl/min),Volume (bbl)');
    expect(header).toBeGreaterThan(0);
    const row = lines[header + 1 + 400].split(',').map(Number);
    expect(row[0]).toBeCloseTo(record.time[400], 1);
    expect(row[1] * PSI).toBeCloseTo(record.pressure[400], -2);
    expect(row[3] * BBL).toBeCloseTo(record.volume[400], 3);
    expect(lines.length - header - 2).toBe(record.time.length);
  });

  it('should write the semicolon layout with decimal commas and a second header row of units', () => {
    const text = recordToDelimited(record, 'semicolon-kpa-m3');
    expect(text).toContain('\r\n');
    const lines = text.split('\r\n');
    const header = lines.indexOf('Time;Pressure;Rate;Volume');
    expect(lines[header + 1]).toBe('min;kPa;m3/min;m3');
    const cells = lines[header + 2 + 300].split(';');
    expect(cells).toHaveLength(4);
    expect(Number(cells[1].replace(',', '.')) * 1e3).toBeCloseTo(record.pressure[300], -2);
    expect(lines).toContain('Mud density;1,200;sg');
  });

  it('should write the tab layout with increasing ISO timestamps, bar and L/min', () => {
    const lines = recordToDelimited(record, 'tab-bar-litre', { startTime: '2026-03-14T08:00:00Z' }).split('\n');
    const header = lines.indexOf('Timestamp\tPressure [bar]\tFlow [L/min]\tVolume [L]');
    const first = lines[header + 1].split('\t');
    expect(first[0]).toBe('2026-03-14T08:00:00.000Z');
    const later = lines[header + 101].split('\t');
    expect(Date.parse(later[0]) - Date.parse(first[0])).toBe(Math.round(record.time[100] * 1000));
    expect(Number(later[1]) * 1e5).toBeCloseTo(record.pressure[100], -2);
  });
});

describe('LAS writer', () => {
  it('should write a time-indexed LAS 2.0 file with one data line per sample', () => {
    const text = recordToLas(record);
    expect(text.startsWith('~VERSION INFORMATION')).toBe(true);
    for (const s of ['~WELL INFORMATION', '~CURVE INFORMATION', '~PARAMETER INFORMATION', '~A']) expect(text).toContain(s);
    const data = text.split('\n~A')[1].split('\n').slice(1).filter((l) => l.trim());
    expect(data).toHaveLength(record.time.length);
    expect(Number(data[10].trim().split(/\s+/)[1]) * 1e3).toBeCloseTo(record.pressure[10], -2);
    expect(text).toMatch(/STEP\.S\s+1\.000/);
  });

  it('should write a depth-indexed density log in g/cm3', () => {
    const text = densityLogToLas({ depth: [0, 5, 10], density: [2000, 2010, 2020], well: 'HF-6' });
    expect(text).toMatch(/RHOB\.G\/C3/);
    expect(text.trim().split('\n').slice(-1)[0].trim().split(/\s+/)).toEqual(['10.00', '2.0200']);
  });
});
