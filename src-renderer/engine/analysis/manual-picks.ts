/**
 * Hand-set picks: an engineer moves or removes an automatic pick on the chart and gives a
 * reason. The hand-set pick replaces the automatic one of the same kind and cycle and is
 * flagged `manual` with its reason; a null pick removes the automatic one.
 */
import type { AnalysisOptions } from '../analysis-options';
import { EngineError } from '../errors';
import { PICK_KINDS, type CycleAnalysis } from '../result';

/**
 * Applies hand-set picks to analysed cycles (returns new cycle objects; the input is not changed).
 *
 * @param cycles analysed cycles, 1-based `cycle.index`.
 * @param manualPicks replacements: cycle (1-based), kind, pick (pressure Pa, time s) or null, reason (non-empty).
 * @param sampleCount number of samples of the record (a pick's sampleIndex must lie inside).
 * @returns the cycles with the replacements applied.
 * @throws EngineError 'bad-argument' for an unknown cycle or kind, an empty reason, or a pick
 *   with a non-finite pressure or time or a sample index outside the record.
 * @example applyManualPicks(cycles, [{ cycle: 1, kind: 'leakOff', pick: null, reason: 'noise' }], n)
 */
export function applyManualPicks(
  cycles: CycleAnalysis[],
  manualPicks: NonNullable<AnalysisOptions['manualPicks']>,
  sampleCount: number,
): CycleAnalysis[] {
  const out = cycles.map((c) => ({ ...c, picks: { ...c.picks } }));
  for (const m of manualPicks) {
    const target = out.find((c) => c.cycle.index === m.cycle);
    if (!target) throw new EngineError('bad-argument', `a hand-set pick names cycle ${m.cycle}, but the record has ${cycles.length}`, {}, `a cycle from 1 to ${cycles.length}`);
    if (!PICK_KINDS.includes(m.kind)) throw new EngineError('bad-argument', `unknown pick kind "${m.kind}"`, {}, PICK_KINDS.join(', '));
    if (!m.reason || !m.reason.trim()) throw new EngineError('bad-argument', `the hand-set ${m.kind} pick of cycle ${m.cycle} has no reason`, {}, 'a reason for every hand-set pick');
    if (m.pick === null) {
      delete target.picks[m.kind];
      continue;
    }
    const { pressure, time, sampleIndex } = m.pick;
    if (!Number.isFinite(pressure) || !Number.isFinite(time)) {
      throw new EngineError('bad-argument', `the hand-set ${m.kind} pick of cycle ${m.cycle} has a non-finite pressure or time`, {}, 'pressure in Pa and time in s');
    }
    if (!Number.isInteger(sampleIndex) || sampleIndex < 0 || sampleIndex >= sampleCount) {
      throw new EngineError('bad-argument', `the hand-set ${m.kind} pick of cycle ${m.cycle} points at sample ${sampleIndex}`, {}, `a sample index from 0 to ${sampleCount - 1}`);
    }
    target.picks[m.kind] = { ...m.pick, kind: m.kind, manual: true, reason: m.reason };
  }
  return out;
}
