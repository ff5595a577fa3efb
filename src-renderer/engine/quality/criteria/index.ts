/**
 * The registry of quality criteria, in report order. Adding a criterion: one file in
 * this folder exporting a QualityCriterion, and one line here.
 */
import type { QualityCriterion } from './criterion';
import { cycleRepeat } from './cycle-repeat';
import { gaugeRange } from './gauge-range';
import { loadingLinearity } from './loading-linearity';
import { loadingStiffness } from './loading-stiffness';
import { pickAgreement } from './pick-agreement';
import { rateStability } from './rate-stability';
import { sampling } from './sampling';
import { secondCycle } from './second-cycle';
import { shutInStability } from './shut-in-stability';

export const QUALITY_CRITERIA: readonly QualityCriterion[] = [
  loadingLinearity,
  loadingStiffness,
  rateStability,
  shutInStability,
  secondCycle,
  cycleRepeat,
  sampling,
  gaugeRange,
  pickAgreement,
];

export type { QualityCriterion, CriterionFinding } from './criterion';
