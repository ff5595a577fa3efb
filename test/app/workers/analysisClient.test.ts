import { describe, expect, it } from 'vitest';
import { EngineError, isEngineError } from '../../../src-renderer/engine/errors';
import { errorFromWorker } from '../../../src-renderer/app/workers/analysisClient';
import { previewFile, runEngineRequest } from '../../../src-renderer/app/workers/engineCalls';

const enc = new TextEncoder();

describe('analysis worker messages', () => {
  it('should rebuild an engine error with its code, place and message from its plain form', () => {
    const original = new EngineError('non-numeric-cell', '"12O4.5" is not a number', { file: 'a.csv', line: 135, column: 2 }, 'pressure in psi');
    const copy = errorFromWorker({ name: original.name, code: original.code, message: original.message, location: { ...original.location }, expected: original.expected });
    expect(isEngineError(copy)).toBe(true);
    expect((copy as EngineError).code).toBe('non-numeric-cell');
    expect((copy as EngineError).location).toEqual({ file: 'a.csv', line: 135, column: 2 });
    expect(copy.message).toBe(original.message);
  });

  it('should keep other errors as plain errors', () => {
    const copy = errorFromWorker({ name: 'TypeError', code: 'internal', message: 'x is undefined', location: {} });
    expect(isEngineError(copy)).toBe(false);
    expect(copy.name).toBe('TypeError');
  });

  it('should preview a file: columns and units as detected, and the place of the first bad cell', async () => {
    // A contractor table invented here: elapsed time, pressure in psi, rate in bbl/min; row 4 holds a letter O.
    const text = 'Time (s),Pressure (psi),Rate (bbl/min)\n0,100,0.5\n1,110,0.5\n2,12O,0.5\n3,130,0.5\n';
    const p = await previewFile(enc.encode(text), 'bad.csv');
    expect(p.table.columns.map((c) => c.role)).toEqual(['time', 'pressure', 'rate']);
    expect(p.table.columns[1].unit.toLowerCase()).toBe('psi');
    expect(p.parsed).toBeNull();
    expect(p.parseError).toMatchObject({ code: 'non-numeric-cell', line: 4, column: 2 });
  });

  it('should parse and analyse through the same request switch the worker uses', async () => {
    const rows = ['Time (s),Pressure (psi),Rate (bbl/min)'];
    for (let t = 0; t <= 600; t++) {
      const pumping = t >= 30 && t < 330;
      const p = t < 30 ? 0 : pumping ? (t - 30) * 5 : 1500 - (t - 330) * 0.5;
      rows.push(`${t},${p.toFixed(2)},${pumping ? 0.5 : 0}`);
    }
    const bytes = enc.encode(rows.join('\n'));
    const record = await runEngineRequest({ id: 1, op: 'parse', bytes, fileName: 'ok.csv' }) as { time: Float64Array };
    expect(record.time.length).toBe(601);
    // A surface gauge needs the depth and mud density to reach downhole (given here as overrides).
    const analysis = await runEngineRequest({ id: 2, op: 'analyse', record: record as never, options: { overrides: { depthTvd: 1500 as never, mudDensity: 1200 as never } } }) as { quality: { grade: string } };
    expect(['A', 'B', 'C', 'D', 'E']).toContain(analysis.quality.grade);
  });
});
