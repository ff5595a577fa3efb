import { describe, expect, it } from 'vitest';
import { analyzeFile, analyzeRecord } from '../../src-renderer/engine/analyze';
import { EngineError } from '../../src-renderer/engine/errors';
import type { TestRecord, TestType } from '../../src-renderer/engine/record';
import type { AnalysisResult } from '../../src-renderer/engine/result';
import { recordToDelimited } from '../../src-renderer/engine/synthetic/delimited-writer';
import { generateSyntheticTest } from '../../src-renderer/engine/synthetic/generate';
import type { SyntheticSpec } from '../../src-renderer/engine/synthetic/spec';

// End-to-end on synthetic records whose truth the spec sets (synthetic/generate.ts): the
// event pressures at depth, the mud column rho g TVD and the loading stiffness 1/(c V).
// Event definitions: White, Traugott & Swarbrick (2002); Zoback et al. (2003) (METHODS.md).
const MPA = 1e6;

function generated(type: TestType, extra: Partial<SyntheticSpec> = {}) {
  return generateSyntheticTest({ type, depthTvd: 2000, shmin: 34e6, seed: 3, ...extra });
}

/** The record without its stated type, so the pipeline has to infer it. */
function unlabelled(record: TestRecord): TestRecord {
  const metadata = { ...record.metadata };
  delete metadata.testType;
  return { ...record, metadata };
}

describe('analyzeRecord', () => {
  it.each(['fit', 'lot', 'xlot', 'srt', 'dfit'] as const)('should infer the type of a %s record', (type) => {
    const { record } = generated(type);
    const result = analyzeRecord(unlabelled(record));
    expect(result.type).toBe(type);
    expect(result.typeInferred).toBe(true);
    expect(result.typeReasons.length).toBeGreaterThan(0);
  });

  it('should take the stated type from the file, and the option over the file', () => {
    const { record } = generated('lot');
    expect(analyzeRecord(record).typeInferred).toBe(false);
    const forced = analyzeRecord(record, { type: 'fit' });
    expect(forced.type).toBe('fit');
    expect(forced.warnings.join(' ')).toMatch(/looks like a LOT/);
  });

  it('should bring a surface gauge to depth with the mud column of the truth', () => {
    const { record, truth } = generated('xlot');
    const result = analyzeRecord(record);
    expect(result.hydrostaticCorrection).toBeCloseTo(truth.hydrostatic, 0);
    expect(result.downholePressure[100] - record.pressure[100]).toBeCloseTo(truth.hydrostatic, 0);
  });

  it('should recover the XLOT loading stiffness and loading events of the truth', () => {
    const { record, truth } = generated('xlot');
    const result = analyzeRecord(record);
    expect(result.cycles).toHaveLength(2);
    const [first, second] = result.cycles;
    expect(first.loadingFit!.slope / truth.loadingSlope).toBeCloseTo(1, 2);
    expect(first.expectedSlope! / truth.expectedSlope).toBeCloseTo(1, 3);
    const t1 = truth.cycles[0].picks;
    expect(Math.abs(first.picks.leakOff!.pressure - t1.leakOff!.pressure)).toBeLessThan(0.1 * MPA);
    expect(Math.abs(first.picks.breakdown!.pressure - t1.breakdown!.pressure)).toBeLessThan(0.05 * MPA);
    expect(Math.abs(first.picks.propagation!.pressure - t1.propagation!.pressure)).toBeLessThan(0.1 * MPA);
    const t2 = truth.cycles[1].picks;
    expect(Math.abs(second.picks.reopening!.pressure - t2.reopening!.pressure)).toBeLessThan(0.1 * MPA);
    expect(second.picks.leakOff).toBeUndefined();
    expect(second.picks.breakdown).toBeUndefined();
    // Every shut-in yields an ISIP and a primary closure among its candidates.
    for (const c of result.cycles) {
      expect(c.picks.isip).toBeDefined();
      expect(c.picks.closure).toBeDefined();
      expect(c.closureCandidates.map((k) => k.method)).toContain(c.picks.closure!.method);
      expect(c.picks.closure!.pressure).toBeLessThanOrEqual(c.picks.isip!.pressure + 1e-6);
    }
    expect(result.stress.shmin).not.toBeNull();
    expect(['A', 'B', 'C', 'D', 'E']).toContain(result.quality.grade);
  });

  it('should pick the limit of a FIT and no fracture events', () => {
    const { record, truth } = generated('fit');
    const c = analyzeRecord(record).cycles[0];
    expect(Math.abs(c.picks.fitMaximum!.pressure - truth.cycles[0].picks.fitMaximum!.pressure)).toBeLessThan(0.05 * MPA);
    for (const kind of ['leakOff', 'breakdown', 'propagation', 'isip', 'closure', 'reopening', 'extension'] as const) expect(c.picks[kind]).toBeUndefined();
  });

  it('should pick the LOT leak-off without breakdown or reopening', () => {
    const { record, truth } = generated('lot');
    const c = analyzeRecord(record).cycles[0];
    expect(Math.abs(c.picks.leakOff!.pressure - truth.cycles[0].picks.leakOff!.pressure)).toBeLessThan(0.1 * MPA);
    expect(c.picks.breakdown).toBeUndefined();
    expect(c.picks.reopening).toBeUndefined();
    expect(c.picks.fitMaximum).toBeUndefined();
  });

  it('should give the SRT extension with its rate', () => {
    const { record, truth } = generated('srt');
    const c = analyzeRecord(record).cycles[0];
    const set = truth.cycles[0].picks.extension!;
    expect(Math.abs(c.picks.extension!.pressure - set.pressure)).toBeLessThan(0.2 * MPA);
    expect(c.picks.extension!.rate! / set.rate!).toBeCloseTo(1, 1);
    expect(c.stepRate!.steps.length).toBeGreaterThanOrEqual(4);
    expect(c.picks.leakOff).toBeUndefined();
  });

  it('should pick the DFIT breakdown and shut-in', () => {
    const { record, truth } = generated('dfit');
    const c = analyzeRecord(record).cycles[0];
    expect(Math.abs(c.picks.breakdown!.pressure - truth.cycles[0].picks.breakdown!.pressure)).toBeLessThan(0.05 * MPA);
    expect(c.picks.isip).toBeDefined();
  });

  it('should follow the softer loading line of a record with air in the line', () => {
    const { record, truth } = generated('lot', { flaws: { airInLine: true } });
    const c = analyzeRecord(record).cycles[0];
    // Truth: stiffness 0.45 x 1/(c V) (synthetic spec). The fitted line follows the record, not the expectation.
    expect(c.loadingFit!.slope / truth.loadingSlope).toBeCloseTo(1, 1);
    expect(c.loadingFit!.slope / c.expectedSlope!).toBeLessThan(0.6);
  });

  it('should keep a second-cycle departure above the breakdown, with a warning', () => {
    // Flaw set by the synthetic spec: the second cycle reopens 0.5 MPa above the first breakdown.
    const { record, truth } = generated('xlot', { flaws: { badSecondCycle: 'reopening-above-breakdown' } });
    const result = analyzeRecord(record);
    const reopening = result.cycles[1].picks.reopening!;
    expect(Math.abs(reopening.pressure - truth.cycles[1].picks.reopening!.pressure)).toBeLessThan(0.2 * MPA);
    expect(reopening.pressure).toBeGreaterThan(result.cycles[0].picks.breakdown!.pressure);
    expect(result.warnings.join(' ')).toMatch(/not a valid reopening/);
  });

  it('should pick leak-off through 30 kPa of gauge noise', () => {
    const { record, truth } = generated('lot', { noiseSd: 30e3 });
    const c = analyzeRecord(record).cycles[0];
    expect(Math.abs(c.picks.leakOff!.pressure - truth.cycles[0].picks.leakOff!.pressure)).toBeLessThan(0.15 * MPA);
  });

  it('should let options win over the file metadata', () => {
    const { record, truth } = generated('lot');
    const deeper = analyzeRecord(record, { overrides: { depthTvd: 2500 as never } });
    expect(deeper.metadata.depthTvd).toBe(2500);
    // rho g h scales with h (hydrostatic law): 2500 m / 2000 m of the same mud.
    expect(deeper.hydrostaticCorrection / truth.hydrostatic).toBeCloseTo(2500 / 2000, 3);
  });

  it('should replace and remove automatic picks by hand, keeping the reason', () => {
    const { record } = generated('xlot');
    const auto = analyzeRecord(record);
    const moved = { ...auto.cycles[0].picks.leakOff!, pressure: 35.2e6, time: 350, sampleIndex: 350 };
    const result = analyzeRecord(record, {
      manualPicks: [
        { cycle: 1, kind: 'leakOff', pick: moved, reason: 'bend starts earlier on the chart' },
        { cycle: 2, kind: 'propagation', pick: null, reason: 'pumping stopped too soon' },
      ],
    });
    expect(result.cycles[0].picks.leakOff).toMatchObject({ pressure: 35.2e6, manual: true, reason: 'bend starts earlier on the chart' });
    expect(result.cycles[1].picks.propagation).toBeUndefined();
    expect(auto.cycles[1].picks.propagation).toBeDefined();
    expect(() => analyzeRecord(record, { manualPicks: [{ cycle: 9, kind: 'isip', pick: null, reason: 'x' }] })).toThrow(EngineError);
  });

  it('should refuse a surface gauge without mud density, naming it', () => {
    const { record } = generated('lot');
    const metadata = { ...record.metadata };
    delete metadata.mudDensity;
    expect(() => analyzeRecord({ ...record, metadata })).toThrow(/mud density/);
    expect(() => analyzeRecord({ ...record, metadata }, { overrides: { gaugePosition: 'downhole' } })).not.toThrow();
  });

  it('should refuse a record that never pumps', () => {
    const { record } = generated('lot');
    const still = { ...record, rate: new Float64Array(record.rate.length), volume: new Float64Array(record.volume.length) };
    try {
      analyzeRecord(still);
      expect.unreachable();
    } catch (e) {
      expect((e as EngineError).code).toBe('no-rate-or-volume');
    }
  });

  it('should be deterministic', () => {
    const { record } = generated('xlot', { seed: 9 });
    const strip = (r: AnalysisResult) => JSON.stringify({ ...r, downholePressure: Array.from(r.downholePressure.subarray(0, 50)) });
    expect(strip(analyzeRecord(record))).toBe(strip(analyzeRecord(record)));
  });
});

describe('analyzeFile', () => {
  it('should import a contractor-style CSV and analyse it', async () => {
    const { record, truth } = generated('xlot');
    const bytes = new TextEncoder().encode(recordToDelimited(record, 'comma-psi-bbl'));
    const { analysis } = await analyzeFile(bytes, 'hf3-xlot.csv');
    expect(analysis.type).toBe('xlot');
    expect(Math.abs(analysis.cycles[0].picks.breakdown!.pressure - truth.cycles[0].picks.breakdown!.pressure)).toBeLessThan(0.05 * MPA);
  });
});
