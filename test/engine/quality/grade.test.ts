import { describe, expect, it } from 'vitest';
import { assessQuality } from '../../../src-renderer/engine/quality/assess';
import { gradeFromCriteria } from '../../../src-renderer/engine/quality/grade';
import { DEFAULT_LIMITS } from '../../../src-renderer/engine/quality/limits';
import type { CriterionResult } from '../../../src-renderer/engine/result';
import { generateSyntheticTest } from '../../../src-renderer/engine/synthetic/generate';
import type { SyntheticSpec } from '../../../src-renderer/engine/synthetic/spec';
import { contextFromTruth } from '../synthetic/context-from-truth';

const BASE = { depthTvd: 2000, shmin: 34e6, porePressure: 20e6, seed: 5 };
const AGREE = { closureCandidates: { 1: [34e6, 34.2e6], 2: [34e6, 34.1e6], 3: [34e6, 34.1e6] } };

function grade(spec: Partial<SyntheticSpec> & { type: SyntheticSpec['type'] }) {
  const { record, truth } = generateSyntheticTest({ ...BASE, ...spec });
  return assessQuality(contextFromTruth(record, truth, AGREE));
}

function result(id: string, pass: boolean | null, severity: 'major' | 'minor'): CriterionResult {
  return { id, pass, value: null, limit: null, message: '', severity };
}

describe('quality grade', () => {
  // Scale related to Morawietz et al. (2020) in grade.ts: the test type caps the best class.
  it('should give A to a clean XLOT and DFIT, B to a clean LOT, C to a clean FIT', () => {
    expect(grade({ type: 'xlot', cycles: 3 }).grade).toBe('A');
    expect(grade({ type: 'dfit' }).grade).toBe('A');
    expect(grade({ type: 'lot' }).grade).toBe('B');
    const fit = grade({ type: 'fit' });
    expect(fit.grade).toBe('C');
    expect(fit.explanation).toContain('only bounds Shmin from below');
  });

  it('should lower the grade one letter per failed major criterion', () => {
    expect(grade({ type: 'xlot', flaws: { clippedGauge: true } }).grade).toBe('B');
    expect(grade({ type: 'xlot', flaws: { clippedGauge: true, leakingShutIn: true } }).grade).toBe('C');
    const worst = grade({ type: 'lot', sampleInterval: 10, flaws: { leakingShutIn: true, clippedGauge: true } });
    expect(worst.grade).toBe('E');
    expect(worst.explanation).toContain('sampling');
  });

  it('should weigh minor failures half as much as major ones', () => {
    const base = [result('loading-linearity', true, 'major')];
    expect(gradeFromCriteria('xlot', [...base, result('rate-stability', false, 'minor')], 'closure').grade).toBe('B');
    expect(gradeFromCriteria('xlot', [...base, result('rate-stability', false, 'minor'), result('pick-agreement', false, 'minor')], 'closure').grade).toBe('B');
    expect(gradeFromCriteria('xlot', [...base, result('a', false, 'minor'), result('b', false, 'minor'), result('c', false, 'minor')], 'closure').grade).toBe('C');
  });

  it('should cap at B when a major criterion cannot be judged, and by the Shmin source', () => {
    expect(gradeFromCriteria('xlot', [result('gauge-range', null, 'major')], 'closure').grade).toBe('B');
    expect(gradeFromCriteria('xlot', [], 'isip').grade).toBe('B');
    expect(gradeFromCriteria('lot', [], 'leakOff').grade).toBe('C');
    const none = gradeFromCriteria('xlot', [], null);
    expect(none.grade).toBe('E');
    expect(none.explanation).toContain('unusable');
  });
});

describe('quality limits table', () => {
  it('should document every default limit with a unit, rationale and source', () => {
    for (const l of DEFAULT_LIMITS) {
      expect(l.key).toMatch(/^[a-z-]+\.[A-Za-z0-9]+$/);
      expect(l.unit.length).toBeGreaterThan(0);
      expect(l.rationale.length).toBeGreaterThan(20);
      expect(l.source.length).toBeGreaterThan(5);
    }
    // contracts/cli.md example: loading-linearity limit 0.995.
    expect(DEFAULT_LIMITS.find((l) => l.key === 'loading-linearity.minR2')?.value).toBe(0.995);
  });
});
