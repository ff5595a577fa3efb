import { describe, expect, it } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';
import { ArchiveError } from '../../src-renderer/archive/errors';
import { kgPerCubicMetre } from '../../src-renderer/engine/units/quantity';

// Hydrostatic law P = rho g h with standard gravity g = 9.80665 m/s2 (exact; NIST SP 811,
// appendix B); the correction a surface gauge needs to reach the tested depth.
const G = 9.80665;

async function importedTest(overrides: Record<string, unknown>) {
  const opened = await openTestArchive();
  const [outcome] = await opened.archive.importFiles([simpleFile('hf-2.csv', 'HF-2', { peak: 20e6, tvd: 1500, samples: 9 })], 'Ana Petrov', { overrides });
  return { ...opened, testId: outcome.testId! };
}

describe('progressive test opening', () => {
  it('should read a test without running the engine, with the downhole pressure of a surface gauge', async () => {
    const { archive, engine, testId } = await importedTest({ mudDensity: kgPerCubicMetre(1200), gaugePosition: 'surface' });
    const before = engine.calls.analyse;
    const header = await archive.getTestHeader(testId);
    expect(engine.calls.analyse).toBe(before);
    // 1200 kg/m3 x 9.80665 m/s2 x 1500 m = 17,651,970 Pa (the engine's own worked example).
    expect(header.hydrostaticCorrection).toBeCloseTo(1200 * G * 1500, 6);
    expect(header.downholePressure).not.toBeNull();
    const p = header.samples.pressure;
    for (let i = 0; i < p.length; i++) expect(header.downholePressure![i]).toBeCloseTo(p[i] + 1200 * G * 1500, 3);
    expect(header.summary.id).toBe(testId);
    expect(header.summary.wellName).toBe('HF-2');
  });

  it('should use a downhole gauge as recorded (no correction)', async () => {
    const { archive, testId } = await importedTest({ gaugePosition: 'downhole' });
    const header = await archive.getTestHeader(testId);
    expect(header.hydrostaticCorrection).toBe(0);
    expect(Array.from(header.downholePressure!)).toEqual(Array.from(header.samples.pressure));
  });

  it('should give no downhole series when a surface gauge lacks the mud density', async () => {
    const { archive, testId } = await importedTest({ gaugePosition: 'surface' });
    const header = await archive.getTestHeader(testId);
    expect(header.downholePressure).toBeNull();
    expect(header.hydrostaticCorrection).toBeNull();
  });

  it('should analyse the header\'s own samples exactly as getTest does', async () => {
    const { archive, engine, testId } = await importedTest({ mudDensity: kgPerCubicMetre(1200) });
    const auto = (await archive.getTest(testId)).analysis.cycles[0].picks.fitMaximum!;
    await archive.movePick(testId, 1, 'fitMaximum', { ...auto, pressure: 19e6, manual: true, reason: 'spike' }, 'spike at the peak', 'Ben Osei');
    const header = await archive.getTestHeader(testId);
    const calls = engine.calls.analyse;
    const detail = await archive.getTestDetail(header);
    expect(engine.calls.analyse).toBe(calls + 1);
    expect(detail.samples).toBe(header.samples);
    const whole = await archive.getTest(testId);
    expect(detail.analysis.cycles[0].picks.fitMaximum?.pressure).toBe(19e6);
    expect(detail.analysis.quality.grade).toBe(whole.analysis.quality.grade);
    expect(detail.manualPicks).toEqual(whole.manualPicks);
    expect(detail.log.map((e) => e.id)).toEqual(whole.log.map((e) => e.id));
    expect(detail.summary).toEqual(whole.summary);
  });

  it('should refuse an unknown test with not-found', async () => {
    const { archive } = await openTestArchive();
    await expect(archive.getTestHeader('no-such-test')).rejects.toSatisfy((e: unknown) => e instanceof ArchiveError && e.code === 'not-found');
  });
});
