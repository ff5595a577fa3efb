import type { TestMetadata, TestType } from './record';
import type { Pick, PickKind } from './result';

/** Options of one analysis run; the command line and the app build the same object. */
export interface AnalysisOptions {
  /** Test type; inferred from the record when absent. */
  type?: TestType;
  /** Values that win over the file's metadata (command line, or the engineer in the app). */
  overrides?: Partial<TestMetadata>;
  /** Quality limits overriding the defaults (per project), by criterion limit key. */
  limits?: Record<string, number>;
  /** Friction coefficient for the stress polygon, default 0.6. */
  frictionCoefficient?: number;
  /** Hand-set picks that replace automatic ones (cycle is 1-based); pick null removes the automatic pick. */
  manualPicks?: { cycle: number; kind: PickKind; pick: Pick | null; reason: string }[];
}
