/**
 * The `model` command (contracts/cli.md): analyses every file as `analyze` does, takes the
 * tests whose grade is at least --min-grade (default B), fits the regional stress model
 * and prints the tests, the Shmin trend and the stress table; --format csv|xlsx --out FILE
 * writes the export as well. JSON pressures are MPa and depths m, whatever --units says
 * (--units chooses the units of the exported file).
 */
import { writeFile } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import { EngineError, isEngineError } from '../errors';
import { stressTableCsv } from '../export/csv';
import { stressTableXlsx } from '../export/xlsx';
import { measuredDepthAtTvd } from '../model/well-path';
import { buildRegionalModel, stressTable, type ModelTestInput, type RegionalModel, type StressTableRow } from '../model/regional-model';
import { UNNAMED_FORMATION, type TrendOptions } from '../model/shmin-trend';
import { intervalsFromBreaks, intervalsFromFormations } from '../model/trend-intervals';
import type { OverburdenSettings, VerticalStressProfile } from '../model/vertical-stress';
import { GRADES, type Grade } from '../result';
import { parseQuantity } from '../units/parseQuantity';
import type { UnitSystem } from '../units/unitSystem';
import { analyzeFilesForCli, type CliFileOutcome } from './analyze-files';
import { SAFETY_CAUTION } from './caution';
import { errorJson, rounded, TOOL_NAME } from './json-output';
import { sideInputs, sortModelFiles, verticalStressProfile, type ModelSideInputs, type SideFile } from './model-inputs';
import { parseCliArguments, type CliArguments } from './options';
import { badArguments, TOOL_VERSION } from './run-cli';

/** Value options of `model` beyond the shared ones. */
export const MODEL_OPTIONS = [
  'min-grade', 'step', 'from', 'to', 'format', 'out', 'units', 'friction', 'water-depth', 'rig-floor', 'density-log', 'breaks',
  'survey', 'well', 'pp-points',
] as const;

export const MODEL_USAGE = `Stress Ledger command line: regional stress model from tested files.

Usage:
  cli model FILE [FILE ...] [options] [--json]

Every file is analysed as by "analyze" (the shared options --type, --tvd, --mud, --gauge,
--pp, --sv, --system-volume, --compressibility apply to each file). Tests graded at least
--min-grade with a Shmin value are fitted; FIT values are lower bounds, shown, not fitted.

Model options:
  --min-grade A|B|C|D|E      worst grade taken (default B)
  --step VALUE[UNIT]         table depth step (default 100m)
  --from VALUE[UNIT]         first table TVD (default one step)
  --to VALUE[UNIT]           last table TVD (default the deepest test, rounded up to a step)
  --pp GRADIENT              pore-pressure gradient of the model (default 10.0kPa/m, hydrostatic);
                             with --pp-points, the gradient below the deepest measurement
  --pp-points FILE           pore-pressure measurements (CSV/TXT with a TVD column and a Pp column,
                             units in the headers, e.g. "TVD (m),Pp (MPa)"; Pp may also be a
                             gradient or EMW, e.g. "Pp (sg)"; an optional Well column): Pp joined
                             by straight lines through them instead of the gradient
  --survey FILE              directional survey of one well (CSV/TXT with MD, inclination and
                             azimuth columns, MD in m or ft; or LAS with INC and AZI curves):
                             adds the MD column to the table (MD at each TVD, minimum curvature)
  --well NAME                the well of --survey and --pp-points (default the well the file names)
  --sv GRADIENT              overburden gradient below the mudline (default 1psi/ft = 22.62kPa/m)
  --density-log FILE.las     vertical stress from a bulk-density log instead
  --water-depth VALUE[UNIT]  water depth offshore (default 0, onshore)
  --rig-floor VALUE[UNIT]    rig floor elevation above sea level or ground (default 0)
  --friction MU              friction coefficient of the stress polygon (default 0.6)
  --breaks D1,D2,...         fit one Shmin line per depth interval split at these TVDs (e.g. 1500m,2500m)
  --by-formation             fit one Shmin line per formation named in the files (metadata
                             "Formation", "Zone" ...; LAS FORM); tests without a formation are
                             fitted together as "${UNNAMED_FORMATION}" (not with --breaks)
  --format csv|xlsx          write the stress table export (needs --out)
  --out FILE                 export file; the format follows its extension when --format is absent
  --units si|oilfield        units of the export (default si); the JSON is always MPa and m
  --json                     print only the JSON document on stdout

A depth-indexed LAS with a bulk-density curve among the FILEs is taken as the density log
(unless --density-log is given), and a survey file among the FILEs as the survey (unless
--survey is given); stderr says so and they do not count as tests (exit status stays 0).

${SAFETY_CAUTION}
`;

interface ModelCliSettings {
  minGrade: Grade;
  step: number;
  from?: number;
  to?: number;
  format: 'csv' | 'xlsx' | null;
  out: string | null;
  units: UnitSystem;
  friction: number;
  overburden: OverburdenSettings;
  densityLog: string | null;
  survey: string | null;
  well: string | null;
  ppPoints: string | null;
  /** Trend break depths, m (empty: one line). */
  breaks: number[];
  /** One trend line per formation name (--by-formation). */
  byFormation: boolean;
}

function length(value: string, name: string, allowZero: boolean): number {
  const v = parseQuantity(value, 'length', { file: `--${name}` }).value;
  if (!Number.isFinite(v) || v < 0 || (!allowZero && v === 0)) {
    throw new EngineError('bad-argument', `option --${name} must be a depth ${allowZero ? '>= 0' : '> 0'}, got ${value}`, {}, 'a length with its unit, e.g. 100m');
  }
  return v;
}

function modelSettings(args: CliArguments, byFormation: boolean): ModelCliSettings {
  const x = args.extra;
  const minGrade = (x['min-grade'] ?? 'B').toUpperCase() as Grade;
  if (!GRADES.includes(minGrade)) throw new EngineError('bad-argument', `unknown grade "${x['min-grade']}"`, {}, 'A, B, C, D or E');
  let format: 'csv' | 'xlsx' | null = null;
  if (x.format !== undefined) {
    const f = x.format.toLowerCase();
    if (f !== 'csv' && f !== 'xlsx') throw new EngineError('bad-argument', `unknown export format "${x.format}"`, {}, 'csv or xlsx');
    format = f;
  }
  const out = x.out ?? null;
  if (format && !out) throw new EngineError('bad-argument', '--format needs --out FILE', {}, '--out FILE');
  if (out && !format) {
    const ext = extname(out).toLowerCase();
    if (ext !== '.csv' && ext !== '.xlsx') throw new EngineError('bad-argument', `cannot tell the export format of "${out}"`, {}, '--format csv|xlsx or a .csv/.xlsx file name');
    format = ext === '.csv' ? 'csv' : 'xlsx';
  }
  const units = (x.units ?? 'si').toLowerCase();
  if (units !== 'si' && units !== 'oilfield') throw new EngineError('bad-argument', `unknown unit system "${x.units}"`, {}, 'si or oilfield');
  const friction = x.friction === undefined ? 0.6 : Number(x.friction);
  if (!(friction > 0 && friction <= 2)) throw new EngineError('bad-argument', `friction coefficient "${x.friction}" is not in (0, 2]`, {}, 'a number such as 0.6');
  const settings: ModelCliSettings = {
    minGrade,
    step: x.step === undefined ? 100 : length(x.step, 'step', false),
    format, out, units, friction,
    overburden: {
      waterDepth: x['water-depth'] === undefined ? 0 : length(x['water-depth'], 'water-depth', true),
      rigFloorElevation: x['rig-floor'] === undefined ? 0 : length(x['rig-floor'], 'rig-floor', true),
    },
    densityLog: x['density-log'] ?? null,
    survey: x.survey ?? null,
    well: x.well?.trim() || null,
    ppPoints: x['pp-points'] ?? null,
    breaks: x.breaks === undefined ? [] : x.breaks.split(',').map((b) => length(b.trim(), 'breaks', false)),
    byFormation,
  };
  if (byFormation && settings.breaks.length) throw new EngineError('bad-argument', '--by-formation and --breaks cannot be used together', {}, 'one of --by-formation or --breaks');
  if (x.from !== undefined) settings.from = length(x.from, 'from', true);
  if (x.to !== undefined) settings.to = length(x.to, 'to', false);
  if (settings.from !== undefined && settings.to !== undefined && !(settings.to > settings.from)) {
    throw new EngineError('bad-argument', `--to (${x.to}) must be deeper than --from (${x.from})`, {}, 'to > from');
  }
  if (args.sv?.kind === 'pressure' && !settings.densityLog) {
    throw new EngineError('bad-argument', 'for the model --sv must be a gradient (e.g. 22.6kPa/m or 1psi/ft)', {}, 'a gradient');
  }
  if (args.pp?.kind === 'pressure') {
    throw new EngineError('bad-argument', 'for the model --pp must be a gradient (e.g. 10kPa/m or 0.45psi/ft)', {}, 'a gradient');
  }
  return settings;
}

/** The model's view of one analysed file. */
function modelInput(o: CliFileOutcome): ModelTestInput | null {
  const a = o.analysis;
  if (!a) return null;
  const sh = a.stress.shmax;
  const cautions = sh ? [...sh.cautions, ...(sh.detectability ? [sh.detectability.message] : [])] : [];
  return {
    testId: o.path, file: o.file, well: a.metadata.well ?? o.file, field: a.metadata.field ?? '', type: a.type,
    tvd: a.metadata.depthTvd ?? null, md: a.metadata.depthMd ?? null,
    shmin: a.stress.shmin ? { value: a.stress.shmin.value, kind: a.stress.shmin.kind, from: a.stress.shmin.from } : null,
    grade: a.quality.grade, state: 'imported', reviewer: null,
    shmaxReopening: sh && sh.value !== null ? { value: sh.value, cautions } : null,
    ...(a.metadata.formation ? { formation: a.metadata.formation } : {}),
  };
}

/** The trend shape of the settings and notes on it: one line, lines between breaks, or one line per formation. */
function trendOptions(settings: ModelCliSettings, tests: ModelTestInput[]): { trend: TrendOptions | undefined; notes: string[] } {
  if (settings.byFormation) {
    const taken = tests.filter((t) => t.shmin?.kind === 'estimate' && GRADES.indexOf(t.grade) <= GRADES.indexOf(settings.minGrade));
    const { intervals, notes } = intervalsFromFormations(taken);
    return { trend: { shape: { kind: 'intervals', assignBy: 'formation', intervals } }, notes };
  }
  if (settings.breaks.length) return { trend: { shape: { kind: 'intervals', intervals: intervalsFromBreaks(settings.breaks) } }, notes: [] };
  return { trend: undefined, notes: [] };
}

const MPA = 1e6;
const q = (v: number | null, unit: string, factor: number) => (v === null ? null : { value: rounded(v / factor), unit });

function tableRowJson(r: StressTableRow): Record<string, unknown> {
  return {
    tvd: q(r.tvd, 'm', 1),
    ...(r.md !== null ? { md: q(r.md, 'm', 1) } : {}),
    shmin: q(r.shmin, 'MPa', MPA), shminLow: q(r.shminLow, 'MPa', MPA), shminHigh: q(r.shminHigh, 'MPa', MPA),
    shminConfidenceLow: q(r.shminConfidenceLow, 'MPa', MPA), shminConfidenceHigh: q(r.shminConfidenceHigh, 'MPa', MPA),
    sv: q(r.sv, 'MPa', MPA), pp: q(r.pp, 'MPa', MPA),
    shmaxLow: q(r.shmaxLow, 'MPa', MPA), shmaxHigh: q(r.shmaxHigh, 'MPa', MPA),
    regime: r.regime, effectiveStressRatio: rounded(r.effectiveStressRatio), extrapolated: r.extrapolated, segment: r.segment,
  };
}

/**
 * The `model --json` document: tool, caution, tests, shminTrend (null when no line could
 * be fitted), table, plus settings, provenance and cautions (added fields).
 *
 * `inputs` lists the FILEs taken as density log or survey (role, used, error).
 *
 * @param model the fitted model. @param rows its table. @param outcomes per-file analyses.
 * @param settings the command's settings. @param inputs the side inputs used. @param side FILEs that were not tests.
 * @returns the JSON object.
 * @example JSON.stringify(modelDocument(model, rows, outcomes, settings, inputs, side))
 */
function modelDocument(model: RegionalModel, rows: StressTableRow[], outcomes: CliFileOutcome[], settings: ModelCliSettings, inputs: ModelSideInputs, side: SideFile[]): Record<string, unknown> {
  const byId = new Map(model.tests.map((t) => [t.testId, t]));
  const tests = outcomes.map((o) => {
    const t = byId.get(o.path);
    if (!t) return { file: o.file, tvd: null, shmin: null, grade: null, used: false, error: o.error ? errorJson(o.error) : null };
    return {
      file: o.file,
      tvd: q(t.tvd, 'm', 1),
      shmin: t.shmin ? { value: rounded(t.shmin.value / MPA), unit: 'MPa', kind: t.shmin.kind, from: t.shmin.from } : null,
      grade: t.grade, used: t.used, role: t.role, ...(t.reason ? { reason: t.reason } : {}),
      ...(settings.byFormation || t.formation ? { formation: t.formation ?? null } : {}),
      weight: t.weight, studentisedResidual: rounded(t.studentisedResidual ?? null), outlier: t.outlier,
      effectiveStressRatio: rounded(t.effectiveStressRatio), well: t.well, type: t.type ?? null, error: null,
    };
  });
  const segmentJson = (sg: RegionalModel['trend']['segments'][number], i: number) => ({
    name: sg.name, top: q(sg.top, 'm', 1), base: sg.base === null || !Number.isFinite(sg.base) ? null : q(sg.base, 'm', 1),
    intercept: q(sg.intercept, 'MPa', MPA), gradient: q(sg.gradient, 'kPa/m', 1e3), r2: rounded(sg.r2), n: sg.n,
    effectiveStressRatio: rounded(model.trendEffectiveStressRatio[i]?.ratio ?? null),
  });
  // With several depth intervals, shminTrend is the first fitted line and `segments` lists every line.
  const seg = model.trend.segments[0];
  const shminTrend = seg
    ? {
        intercept: q(seg.intercept, 'MPa', MPA), gradient: q(seg.gradient, 'kPa/m', 1e3), r2: rounded(seg.r2), n: seg.n,
        interceptStandardError: q(seg.interceptStandardError, 'MPa', MPA), gradientStandardError: q(seg.gradientStandardError, 'kPa/m', 1e3),
        residualSd: q(seg.residualSd, 'MPa', MPA), confidence: model.trend.confidence,
        depthRange: { from: q(seg.dataTop, 'm', 1), to: q(seg.dataBase, 'm', 1) },
        effectiveStressRatio: rounded(model.trendEffectiveStressRatio[0]?.ratio ?? null),
        segments: model.trend.segments.map(segmentJson),
      }
    : null;
  return {
    tool: { name: TOOL_NAME, version: TOOL_VERSION },
    caution: SAFETY_CAUTION,
    tests,
    shminTrend,
    table: rows.map(tableRowJson),
    reopeningPoints: model.reopeningPoints.map((p) => ({ file: basename(p.testId), tvd: q(p.tvd, 'm', 1), shmax: q(p.shmax, 'MPa', MPA), regime: p.regime, insideBounds: p.insideBounds, cautions: p.cautions })),
    settings: {
      minGrade: settings.minGrade, frictionCoefficient: settings.friction, step: q(settings.step, 'm', 1),
      breaks: settings.breaks.map((b) => q(b, 'm', 1)),
      byFormation: settings.byFormation,
      waterDepth: q(settings.overburden.waterDepth ?? 0, 'm', 1), rigFloorElevation: q(settings.overburden.rigFloorElevation ?? 0, 'm', 1),
      units: settings.units, export: settings.out ? { format: settings.format, file: settings.out } : null,
      densityLog: inputs.densityLog ? { file: inputs.densityLog.file, from: inputs.densityLog.given } : null,
      survey: inputs.wellPath
        ? { file: inputs.wellPath.file, from: inputs.wellPath.given, well: inputs.wellPath.well, stations: inputs.wellPath.path.length, mdRange: { from: q(inputs.wellPath.path[0].md, 'm', 1), to: q(inputs.wellPath.path[inputs.wellPath.path.length - 1].md, 'm', 1) } }
        : null,
      porePressurePoints: inputs.porePressurePoints,
      porePressureSource: model.porePressure.source,
    },
    inputs: side.map((f) => ({
      file: f.file, role: f.role,
      used: !f.error && (f.role === 'density-log' ? inputs.densityLog?.file === f.file && inputs.densityLog.given === 'file' : inputs.wellPath?.file === f.file && inputs.wellPath.given === 'file'),
      error: f.error ? errorJson(f.error) : null,
    })),
    provenance: model.provenance,
    cautions: model.cautions,
  };
}

function tableRange(model: RegionalModel, s: ModelCliSettings): { from: number; to: number } {
  const depths = model.tests.filter((t) => t.tvd !== null && t.tvd > 0).map((t) => t.tvd!);
  const from = s.from ?? s.step;
  const deepest = depths.length ? Math.max(...depths) : from + 10 * s.step;
  let to = s.to ?? Math.ceil(deepest / s.step) * s.step;
  if (!(to > from)) to = from + s.step;
  return { from, to };
}

/**
 * Runs `model FILE... [options]`. The argument list may start with "model".
 *
 * @param argv arguments (e.g. ["model", "a.csv", "b.csv", "--json"]).
 * @param io stdout/stderr writers (functions or objects with write).
 * @returns exit status: 0 every file analysed, 1 a file failed or the export could not be
 *   written, 2 bad arguments.
 * @example await runModelCommand(['model', 'a.csv', '--json'], { stdout: (s) => out.push(s), stderr: () => {} })
 */
export async function runModelCommand(
  argv: string[],
  io: { stdout: ((s: string) => void) | { write(s: string): unknown }; stderr: ((s: string) => void) | { write(s: string): unknown } },
): Promise<number> {
  const sink = (w: typeof io.stdout) => ({ write: (s: string) => (typeof w === 'function' ? w(s) : w.write(s)) });
  const cio = { stdout: sink(io.stdout), stderr: sink(io.stderr) };
  const given = argv[0] === 'model' ? argv : ['model', ...argv];
  // --by-formation is a flag of this command alone: taken out before the shared parser (not after "--").
  const separator = given.indexOf('--');
  const options = separator >= 0 ? given.slice(0, separator) : given;
  const byFormation = options.includes('--by-formation');
  const list = byFormation ? [...options.filter((a) => a !== '--by-formation'), ...(separator >= 0 ? given.slice(separator) : [])] : given;
  const wantsJson = list.includes('--json');
  let args: CliArguments;
  let settings: ModelCliSettings;
  let sv: VerticalStressProfile | undefined;
  let side: SideFile[];
  let testFiles: string[];
  let inputs: ModelSideInputs;
  try {
    args = parseCliArguments(list, MODEL_OPTIONS);
    if (args.help) {
      cio.stdout.write(MODEL_USAGE);
      return 0;
    }
    if (args.files.length === 0) throw new EngineError('bad-argument', 'no file to model', {}, 'one or more file paths after "model"');
    settings = modelSettings(args, byFormation);
    ({ tests: testFiles, side } = await sortModelFiles(args.files));
    inputs = await sideInputs(args, settings, side, cio.stderr);
    sv = verticalStressProfile(args, settings, inputs);
  } catch (e) {
    return badArguments(e, wantsJson, cio);
  }
  for (const f of side) if (f.error) cio.stderr.write(`error: ${f.error.message}\n`);
  const outcomes = await analyzeFilesForCli(testFiles, args, { stderr: cio.stderr });
  const tests = outcomes.map(modelInput).filter((t): t is ModelTestInput => t !== null);
  let status = outcomes.some((o) => o.error) || side.some((f) => f.error) ? 1 : 0;
  try {
    const shape = trendOptions(settings, tests);
    const model = buildRegionalModel(tests, {
      minGrade: settings.minGrade, acceptedOnly: false, frictionCoefficient: settings.friction,
      overburden: settings.overburden, verticalStress: sv, porePressure: inputs.porePressure, trend: shape.trend,
    });
    model.provenance.push(...shape.notes);
    for (const note of shape.notes) if (/no formation name|overlap/.test(note)) cio.stderr.write(`note: ${note}\n`);
    const range = tableRange(model, settings);
    const path = inputs.wellPath;
    if (path) model.provenance.push(path.provenance);
    const rows = stressTable(model, { from: range.from, to: range.to, step: settings.step, ...(path ? { well: path.well, mdAtTvd: (z: number) => measuredDepthAtTvd(path, z) } : {}) });
    if (!model.trend.segments.length) cio.stderr.write(`warning: no Shmin trend: ${model.trend.provenance.filter((p) => p.startsWith('No trend')).join(' ')}\n`);
    if (settings.out && settings.format) {
      const context = { appVersion: TOOL_VERSION, date: new Date().toISOString(), unitSystem: settings.units, title: 'Regional stress table (command line)' };
      try {
        const bytes = settings.format === 'csv'
          ? new TextEncoder().encode(stressTableCsv(model, rows, context))
          : await stressTableXlsx(model, rows, context);
        await writeFile(settings.out, bytes);
        cio.stderr.write(`wrote ${settings.out}\n`);
      } catch (e) {
        cio.stderr.write(`error: could not write ${settings.out}: ${e instanceof Error ? e.message : String(e)}\n`);
        status = 1;
      }
    }
    const doc = modelDocument(model, rows, outcomes, settings, inputs, side);
    if (args.json) cio.stdout.write(JSON.stringify(doc, null, 2) + '\n');
    else cio.stdout.write(modelSummaryText(model, rows, settings.byFormation));
    return status;
  } catch (e) {
    if (isEngineError(e)) return badArguments(e, wantsJson, cio);
    throw e;
  }
}

function modelSummaryText(model: RegionalModel, rows: StressTableRow[], byFormation: boolean): string {
  const lines: string[] = [];
  for (const t of model.tests) lines.push(`${t.file}: ${t.used ? 'fitted' : `not fitted (${t.role === 'lower-bound' ? 'lower bound' : t.reason ?? t.role})`}, grade ${t.grade}${byFormation ? `, formation ${t.formation ?? UNNAMED_FORMATION}` : ''}${t.outlier ? ', OUTLIER' : ''}`);
  const segments = model.trend.segments;
  const line = (seg: RegionalModel['trend']['segments'][number]) => `Shmin = ${(seg.intercept / MPA).toFixed(3)} MPa + ${(seg.gradient / 1e3).toFixed(3)} kPa/m x TVD (R2 ${seg.r2.toFixed(4)}, n ${seg.n})`;
  if (segments.length === 0) lines.push('No Shmin trend could be fitted.');
  else if (segments.length === 1 && segments[0].top === null) lines.push(line(segments[0]));
  else for (const seg of segments) lines.push(`${seg.name}: ${line(seg)}`);
  const withMd = rows.some((r) => r.md !== null);
  lines.push(`TVD m  ${withMd ? '  MD m  ' : ''}  Pp MPa   Shmin MPa (low-high)        Sv MPa   SHmax MPa (low-high)`);
  for (const r of rows) {
    const f = (v: number | null) => (v === null ? '   -   ' : (v / MPA).toFixed(2).padStart(7));
    const md = withMd ? `  ${r.md === null ? '     -' : r.md.toFixed(1).padStart(7)}` : '';
    lines.push(`${r.tvd.toFixed(0).padStart(6)}${md}  ${f(r.pp)}  ${f(r.shmin)} (${f(r.shminLow)}-${f(r.shminHigh)})  ${f(r.sv)}  ${f(r.shmaxLow)}-${f(r.shmaxHigh)}`);
  }
  lines.push('', SAFETY_CAUTION, '');
  return lines.join('\n');
}
