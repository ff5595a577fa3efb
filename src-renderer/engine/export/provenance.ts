/**
 * What every export of the regional model states about itself: the safety caution, who
 * and what produced it, the model settings, the tests used with their grades and who
 * signed each off, and the model's own cautions and provenance lines.
 */
import type { RegionalModel } from '../model/regional-model';
import type { UnitSystem } from '../units/unitSystem';
import { SAFETY_CAUTION } from './safety';

/** Who and what produced an export. */
export interface ExportContext {
  /** Application version, e.g. "0.1.0". */
  appVersion: string;
  /** Date and time of the export, ISO 8601. */
  date: string;
  unitSystem: UnitSystem;
  /** Optional title, e.g. "Harrow Flats regional stress table". */
  title?: string;
  /** Who exported it. */
  author?: string;
}

/** One labelled line of the provenance. */
export interface ProvenanceLine { label: string; value: string }

/**
 * Labelled provenance lines of a model export, caution first.
 *
 * @param model the regional model exported. @param context version, date, units, title.
 * @returns lines in order: caution, title, application, date, units, settings, model notes, cautions.
 * @example provenanceLines(model, { appVersion: '0.1.0', date: '2026-12-01T12:00:00Z', unitSystem: 'si' })[0].label // 'Caution'
 */
export function provenanceLines(model: RegionalModel, context: ExportContext): ProvenanceLine[] {
  const seg = model.trend.segments;
  const lines: ProvenanceLine[] = [
    { label: 'Caution', value: SAFETY_CAUTION },
    { label: 'Title', value: context.title ?? 'Regional stress table' },
    { label: 'Application', value: `Stress Ledger ${context.appVersion}` },
    { label: 'Date', value: context.date },
  ];
  if (context.author) lines.push({ label: 'Exported by', value: context.author });
  lines.push(
    { label: 'Units', value: context.unitSystem === 'si' ? 'SI: m, MPa, kPa/m, EMW in sg' : 'oilfield: ft, psi, psi/ft, EMW in ppg (EMW = P / (0.051948 TVD))' },
    { label: 'Depth reference', value: 'TVD below rig floor' },
    { label: 'Field', value: model.field ?? 'all fields' },
    { label: 'Wells', value: model.wells ? model.wells.join(', ') : 'all wells' },
    { label: 'Tests taken', value: `${model.acceptedOnly ? 'accepted only' : 'any review state'}, grade ${model.minGrade} or better` },
    { label: 'Grade weights', value: Object.entries(model.trend.gradeWeights).map(([g, w]) => `${g} ${w}`).join(', ') },
    { label: 'Bands', value: `${(model.trend.confidence * 100).toFixed(0)} % two-sided; Shmin low/high columns are the prediction band for a new grade-A test` },
    { label: 'Outlier limit', value: `|studentised residual| > ${model.trend.outlierLimit} flagged, kept in the fit` },
    { label: 'Friction coefficient', value: `${model.frictionCoefficient} (q = ${model.frictionalFactor.toFixed(3)})` },
  );
  for (const s of seg) {
    lines.push({
      label: `Shmin trend (${s.name})`,
      value: `${(s.intercept / 1e6).toFixed(3)} MPa + ${(s.gradient / 1e3).toFixed(3)} kPa/m x TVD, R2 ${s.r2.toFixed(4)}, n ${s.n}, tests ${s.dataTop.toFixed(0)}-${s.dataBase.toFixed(0)} m`,
    });
  }
  for (const p of model.provenance) lines.push({ label: 'Model', value: p });
  for (const c of model.cautions.slice(1)) lines.push({ label: 'Caution', value: c });
  return lines;
}

/** Header and rows of the tests table of an export (numbers SI-converted to MPa and m). */
export function testTable(model: RegionalModel): { header: string[]; rows: (string | number | null)[][] } {
  const header = ['Test', 'File', 'Field', 'Well', 'Type', 'TVD [m]', 'Shmin [MPa]', 'Shmin kind', 'Shmin from', 'Grade', 'Review state', 'Signed off by', 'Used in fit', 'Role', 'Weight', 'Studentised residual', 'Outlier', 'Effective stress ratio', 'Note'];
  const rows = model.tests.map((t) => [
    t.testId, t.file, t.field, t.well, t.type ?? null,
    t.tvd === null ? null : Math.round(t.tvd * 10) / 10,
    t.shmin ? Math.round(t.shmin.value / 1e3) / 1e3 : null,
    t.shmin?.kind ?? null, t.shmin?.from ?? null,
    t.grade, t.state, t.state === 'accepted' ? t.reviewer : null,
    t.used ? 'yes' : 'no', t.role, t.weight,
    t.studentisedResidual === undefined || t.studentisedResidual === null ? null : Math.round(t.studentisedResidual * 1000) / 1000,
    t.outlier ? 'yes' : 'no',
    t.effectiveStressRatio === null ? null : Math.round(t.effectiveStressRatio * 1000) / 1000,
    t.reason ?? (t.boundViolated ? 'bound contradicted by the trend' : null),
  ]);
  return { header, rows };
}
