import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyzeRecord } from '../../src-renderer/engine/analyze';
import { EngineError } from '../../src-renderer/engine/errors';
import { importTestFile } from '../../src-renderer/engine/import/import-test-file';
import { GRADE_CEILING_BY_TYPE } from '../../src-renderer/engine/quality/grade';
import type { TestRecord, TestType } from '../../src-renderer/engine/record';
import type { PickKind } from '../../src-renderer/engine/result';
import { GRADES } from '../../src-renderer/engine/result';
import { pickTolerance, type ToleranceInput } from './accuracy-tolerances';

// Every demo file (invented Harrow Flats data, demo/README.md) through import and analysis,
// against the truth demo/manifest.json says it was built with (scripts/make-demo.ts, from
// synthetic/generate.ts). Pressures in the manifest are downhole, MPa.

const DEMO = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'demo');
const MPA = 1e6;
const BARREL_PER_MINUTE = 0.158987294928 / 60; // NIST SP 811: 1 bbl = 0.158987294928 m3
const PSI = 6894.757293168361; // NIST SP 811

interface TruthPick { pressure: number; time: number }
interface ManifestTest {
  file: string;
  type: TestType;
  gauge: 'surface' | 'downhole';
  sampleInterval: { value: number };
  flaws: string[];
  intendedFindings: string[];
  truth: {
    shmin: number;
    porePressure: number;
    mudColumn: number;
    builtLoadingSlope: { value: number };
    cycles: { index: number; pumpStart: number; pumpEnd: number; picks: Partial<Record<PickKind, TruthPick>> }[];
  };
}
const manifest = JSON.parse(readFileSync(join(DEMO, 'manifest.json'), 'utf8')) as {
  tests: ManifestTest[];
  broken: { file: string; problem: string; expectedError: string }[];
};

async function imported(file: string): Promise<TestRecord> {
  return importTestFile(new Uint8Array(readFileSync(join(DEMO, file))), file);
}

/** Tolerance inputs from the manifest truth; the noise is what scripts/make-demo.ts adds (3 kPa surface, 1.5 kPa downhole). */
function toleranceInput(t: ManifestTest, cycle: number): ToleranceInput {
  const c = t.truth.cycles[cycle];
  const first = t.truth.cycles[0].picks;
  const isip = c.picks.isip?.pressure ?? t.truth.shmin;
  const interval = t.sampleInterval.value;
  const start = t.type === 'srt' ? t.truth.porePressure : t.truth.mudColumn;
  const peak = Math.max(...Object.values(c.picks).map((p) => p!.pressure));
  return {
    noiseSd: t.gauge === 'downhole' ? 1.5e3 : 3e3,
    // HF-5 3500 m is written rounded to 1 psi (scripts/make-demo.ts); file values carry a few
    // decimals of their unit, far below the noise.
    gaugeResolution: t.file === 'HF-5_LOT_3500m.csv' ? PSI : 0,
    sampleInterval: interval,
    loadingRisePerSample: t.truth.builtLoadingSlope.value * MPA * 0.5 * BARREL_PER_MINUTE * interval,
    leakOffSpan: ((first.breakdown?.pressure ?? t.truth.shmin + 4.8) - (first.leakOff?.pressure ?? t.truth.shmin)) * MPA,
    reopeningSpan: ((c.picks.propagation?.pressure ?? 0) - (c.picks.reopening?.pressure ?? 0)) * MPA,
    declineToClosure: (isip - t.truth.shmin) * MPA,
    closureDelay: c.picks.closure ? c.picks.closure.time - c.pumpEnd : 0,
    leakRate: t.flaws.includes('leakingShutIn') ? 40e3 / 60 : 0, // generate.ts default leak, Pa/s
    cycleRise: (peak - start) * MPA,
    unsteadyRate: t.flaws.includes('unsteadyRate'),
    extensionAbovePorePressure: ((c.picks.extension?.pressure ?? t.truth.porePressure) - t.truth.porePressure) * MPA,
  };
}

describe('demo files against their manifest truth', () => {
  it.each(manifest.tests.map((t) => [t.file, t] as const))('should recover the truth of %s', async (_file, t) => {
    const record = await imported(t.file);
    const result = analyzeRecord(record);
    expect(result.type).toBe(t.type);
    expect(result.typeInferred).toBe(false);

    // The type is found from the shape alone as well.
    const metadata = { ...record.metadata };
    delete metadata.testType;
    expect(analyzeRecord({ ...record, metadata }).type).toBe(t.type);

    // Every set pick, within the tolerance derived in accuracy-tolerances.ts.
    expect(result.cycles).toHaveLength(t.truth.cycles.length);
    t.truth.cycles.forEach((tc, i) => {
      const picks = result.cycles[i].picks;
      expect(Object.keys(picks).sort(), `${t.file} cycle ${i + 1}`).toEqual(Object.keys(tc.picks).sort());
      for (const [kind, event] of Object.entries(tc.picks) as [PickKind, TruthPick][]) {
        const pick = picks[kind]!;
        if (t.flaws.includes('clippedGauge') && kind === 'breakdown') {
          // Read at the clip: a lower bound of the set breakdown, flagged so.
          expect(pick.bound).toBe('lower');
          expect(pick.pressure).toBeLessThan(event.pressure * MPA);
          continue;
        }
        const error = pick.pressure - event.pressure * MPA;
        expect(Math.abs(error), `${t.file} cycle ${i + 1} ${kind} off by ${(error / MPA).toFixed(3)} MPa`).toBeLessThanOrEqual(pickTolerance(kind, toleranceInput(t, i)));
      }
    });

    // Shmin: a lower bound from a FIT; otherwise the closure of the latest cycle that has one.
    const shmin = result.stress.shmin!;
    if (t.type === 'fit') {
      expect(shmin).toMatchObject({ from: 'fitMaximum', kind: 'lower-bound' });
    } else {
      const latest = Math.max(...t.truth.cycles.filter((c) => c.picks.closure).map((c) => c.index));
      expect(shmin).toMatchObject({ from: 'closure', kind: 'estimate', cycle: latest });
      const error = shmin.value - t.truth.shmin * MPA;
      expect(Math.abs(error), `${t.file}: Shmin off by ${(error / MPA).toFixed(3)} MPa`).toBeLessThanOrEqual(pickTolerance('closure', toleranceInput(t, latest - 1)));
    }

    // Grade: a clean record reaches the best its type allows and fails no criterion; a flawed
    // one fails the criterion the manifest names and grades lower (quality/grade.ts).
    const ceiling = GRADE_CEILING_BY_TYPE[t.type];
    const failed = result.quality.criteria.filter((c) => c.pass === false).map((c) => c.id);
    if (t.flaws.length === 0) {
      expect(failed).toEqual([]);
      expect(result.quality.grade).toBe(ceiling);
    } else {
      // "loading-linearity (when the toe is fitted)": conditional, the engine skips the toe.
      const required = t.intendedFindings.filter((f) => !f.includes('('));
      expect(required.length).toBeGreaterThan(0);
      for (const id of required) expect(failed, t.file).toContain(id);
      expect(GRADES.indexOf(result.quality.grade)).toBeGreaterThan(GRADES.indexOf(ceiling));
    }
    if (t.type === 'xlot') {
      // Every demo XLOT is built with one ISIP and one closure for all its cycles (the manifest
      // truth), so the repeat check passes even where a flaw spoils the later cycle, which is
      // second-cycle's finding ('reopening-above-breakdown', 'no-stable-shut-in').
      const isips = t.truth.cycles.map((c) => c.picks.isip!.pressure);
      expect(Math.max(...isips) - Math.min(...isips)).toBeLessThan(1e-6);
      expect(result.quality.criteria.find((c) => c.id === 'cycle-repeat')?.pass, t.file).toBe(true);
    }
  });

  it('should pick HF-6 2100 m Shmin from the first cycle, its second shut-in being 90 s only', async () => {
    // Set Shmin 35.65 MPa (manifest); a pick on the short second shut-in once gave 35.91.
    const result = analyzeRecord(await imported('HF-6_XLOT_2100m.txt'));
    expect(result.cycles[1].picks.closure).toBeUndefined();
    expect(result.cycles[1].closureCandidates.filter((k) => !k.gradual)).toEqual([]);
    expect(result.stress.shmin).toMatchObject({ from: 'closure', cycle: 1 });
    expect(Math.abs(result.stress.shmin!.value - 35.65e6)).toBeLessThan(0.05e6);
  });
});

describe('broken demo files', () => {
  it.each(manifest.broken.map((b) => [b.file, b] as const))('should refuse %s with its code, line and column', async (_file, b) => {
    // The manifest states where the fault is: "... on line N, column M".
    const where = /line (\d+), column (\d+)/.exec(b.problem);
    expect(where).not.toBeNull();
    const error = await imported(b.file).then(() => null, (e: unknown) => e);
    expect(error).toBeInstanceOf(EngineError);
    const e = error as EngineError;
    expect(e.code).toBe(b.expectedError);
    expect(e.location.file).toBe(b.file);
    expect(e.location.line).toBe(Number(where![1]));
    expect(e.location.column).toBe(Number(where![2]));
    expect(e.expected).toBeTruthy();
  });
});
