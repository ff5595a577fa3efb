/**
 * Inputs of the `model` command besides the test files: the density log, the well survey
 * and the pore-pressure measurements, given by option (--density-log, --survey,
 * --pp-points) or found among the FILEs (a depth-indexed LAS with a density curve, a
 * survey table or LAS). Files found among the FILEs are taken with a note on stderr and
 * do not count as failed tests.
 */
import { readFile } from 'node:fs/promises';
import { basename, extname } from 'node:path';
import { EngineError, isEngineError } from '../errors';
import { parseLasFile } from '../import/lasImport';
import { isSurveyFile, parseSurveyFile, type SurveyImport } from '../import/survey-import';
import type { DepthLog } from '../record';
import { porePressureFromGradient, porePressureFromMeasurements, type PorePressureProfile } from '../model/pore-pressure';
import { parsePorePressureFile, pointsOfWell } from '../model/pore-pressure-file';
import { DENSITY_CURVE_NAMES, verticalStressFromDensityLog, verticalStressFromGradient, type OverburdenSettings, type VerticalStressProfile } from '../model/vertical-stress';
import { trueVerticalDepthAtMd, wellPathFromSurvey, type WellPath } from '../model/well-path';
import type { CliArguments } from './options';

/** What a FILE turned out to be when it is not a test. */
export type SideFileRole = 'density-log' | 'survey';

/** One FILE taken as a side input (or that failed as one). */
export interface SideFile {
  path: string;
  file: string;
  role: SideFileRole;
  densityLog?: DepthLog;
  survey?: SurveyImport;
  error?: EngineError;
}

/**
 * Reads a file given by an option.
 *
 * @param path file path. @param what plain words for the error ("the survey").
 * @returns the bytes.
 * @throws EngineError 'file-not-found' when it cannot be read.
 * @example await readOptionFile('hf3.csv', 'the survey')
 */
export async function readOptionFile(path: string, what: string): Promise<Uint8Array> {
  try {
    return new Uint8Array(await readFile(path));
  } catch {
    throw new EngineError('file-not-found', `cannot read ${what} ${path}`, { file: basename(path) }, 'a readable file');
  }
}

function hasDensityCurve(log: DepthLog): boolean {
  const names = Object.keys(log.curves).map((n) => n.toUpperCase());
  return DENSITY_CURVE_NAMES.some((d) => names.includes(d));
}

/**
 * Sorts the FILEs into tests and side inputs: a LAS depth log with inclination and azimuth
 * curves, or a delimited table headed MD / inclination / azimuth, is a survey; a LAS depth
 * log with a bulk-density curve is a density log; everything else (and any file that
 * cannot be read here) is left to the test analysis, which reports its problems.
 *
 * @param paths the FILEs in order.
 * @returns the test paths and the side files (with `error` when a survey could not be read).
 * @example await sortModelFiles(['a.csv', 'HF-3_survey.csv'])
 */
export async function sortModelFiles(paths: readonly string[]): Promise<{ tests: string[]; side: SideFile[] }> {
  const tests: string[] = [];
  const side: SideFile[] = [];
  for (const path of paths) {
    const file = basename(path);
    const ext = extname(path).toLowerCase();
    if (ext === '.xlsx' || ext === '.xls') {
      tests.push(path);
      continue;
    }
    let bytes: Uint8Array;
    try {
      bytes = new Uint8Array(await readFile(path));
    } catch {
      tests.push(path);
      continue;
    }
    if (isSurveyFile(bytes, file)) {
      try {
        side.push({ path, file, role: 'survey', survey: parseSurveyFile(bytes, file) });
      } catch (e) {
        if (!isEngineError(e)) throw e;
        side.push({ path, file, role: 'survey', error: e.withFile(file) });
      }
      continue;
    }
    if (ext === '.las') {
      try {
        const parsed = parseLasFile(bytes, file);
        if (parsed.kind === 'log' && hasDensityCurve(parsed.log)) {
          side.push({ path, file, role: 'density-log', densityLog: parsed.log });
          continue;
        }
      } catch {
        // Not readable as a log here: the test analysis reports why.
      }
    }
    tests.push(path);
  }
  return { tests, side };
}

/** Side inputs of the model as used: density log, well path, pore-pressure points. */
export interface ModelSideInputs {
  densityLog: { log: DepthLog; file: string; given: 'option' | 'file' } | null;
  wellPath: (WellPath & { file: string; given: 'option' | 'file' }) | null;
  porePressure: PorePressureProfile | undefined;
  porePressurePoints: { file: string; well: string | null; count: number } | null;
}

/** The settings of the model command the side inputs need. */
export interface SideInputSettings {
  densityLog: string | null;
  survey: string | null;
  well: string | null;
  ppPoints: string | null;
  overburden: OverburdenSettings;
}

/**
 * The side inputs: the density log, survey and pore-pressure points given by option, else
 * the density log and survey found among the FILEs (each noted on stderr; a second one is
 * noted as not used). With --pp-points the Pp profile runs through the measurements of the
 * chosen well (--pp, when a gradient, below the deepest); else --pp as a gradient.
 *
 * @param args parsed arguments (--pp). @param s the file options, well and overburden.
 * @param side FILEs sorted out by {@link sortModelFiles}. @param stderr for the notes.
 * @returns the inputs as used.
 * @throws EngineError from reading or parsing a file given by option ('file-not-found',
 *   'bad-las', 'bad-survey', 'unknown-unit', 'non-numeric-cell' ...), 'bad-argument' when
 *   the points name several wells and none is chosen.
 * @example await sideInputs(args, settings, side, process.stderr)
 */
export async function sideInputs(args: CliArguments, s: SideInputSettings, side: SideFile[], stderr: { write(t: string): unknown }): Promise<ModelSideInputs> {
  let densityLog: ModelSideInputs['densityLog'] = null;
  if (s.densityLog) {
    const file = basename(s.densityLog);
    const parsed = parseLasFile(await readOptionFile(s.densityLog, 'the density log'), file);
    if (parsed.kind !== 'log') throw new EngineError('bad-las', 'the density log is indexed by time, not depth', { file }, 'a depth-indexed LAS log');
    densityLog = { log: parsed.log, file, given: 'option' };
  }
  for (const f of side.filter((x) => x.role === 'density-log' && x.densityLog)) {
    if (densityLog) stderr.write(`note: ${f.file} is a depth log with a density curve; not used (the density log is ${densityLog.file})\n`);
    else {
      densityLog = { log: f.densityLog!, file: f.file, given: 'file' };
      stderr.write(`note: ${f.file} is a depth log, not a test: taken as the density log for Sv\n`);
    }
  }
  let survey: { stations: { md: number; inc: number; azi: number }[]; well?: string; file: string; given: 'option' | 'file' } | null = null;
  if (s.survey) {
    const file = basename(s.survey);
    survey = { ...parseSurveyFile(await readOptionFile(s.survey, 'the survey'), file), file, given: 'option' };
  }
  const found = side.filter((x) => x.role === 'survey' && x.survey);
  const preferred = found.find((f) => s.well !== null && f.survey!.well === s.well) ?? found[0];
  for (const f of found) {
    if (survey || f !== preferred) stderr.write(`note: ${f.file} is a directional survey; not used (the survey is ${survey?.file ?? preferred.file})\n`);
    else {
      survey = { ...f.survey!, file: f.file, given: 'file' };
      stderr.write(`note: ${f.file} is a directional survey, not a test: taken as the survey of ${s.well ?? f.survey!.well ?? f.file}\n`);
    }
  }
  if (survey && s.well && survey.well && survey.well !== s.well) stderr.write(`warning: ${survey.file} names well ${survey.well}, used for --well ${s.well}\n`);
  const logWell = densityLog?.log.well;
  if (survey && densityLog && densityLog.log.indexKind !== 'tvd' && logWell && logWell !== (s.well ?? survey.well)) {
    stderr.write(`warning: the density log ${densityLog.file} (well ${logWell}) is converted to TVD with the survey of ${s.well ?? survey.well ?? survey.file}\n`);
  }
  const wellPath = survey ? { ...wellPathFromSurvey(s.well ?? survey.well ?? survey.file, survey.stations), file: survey.file, given: survey.given } : null;
  let porePressure: PorePressureProfile | undefined;
  let porePressurePoints: ModelSideInputs['porePressurePoints'] = null;
  const datum = s.overburden.rigFloorElevation ?? 0;
  if (s.ppPoints) {
    const file = basename(s.ppPoints);
    const chosen = pointsOfWell(parsePorePressureFile(await readOptionFile(s.ppPoints, 'the pore-pressure points'), file), s.well ?? undefined, file);
    porePressure = porePressureFromMeasurements(chosen.points, { datum, gradientBelow: args.pp?.kind === 'gradient' ? args.pp.value : undefined, well: chosen.well });
    porePressurePoints = { file, well: chosen.well ?? null, count: chosen.points.length };
  } else if (args.pp?.kind === 'gradient') {
    porePressure = porePressureFromGradient(args.pp.value, datum);
  }
  return { densityLog, wellPath, porePressure, porePressurePoints };
}

/**
 * Vertical stress of the model: from the density log (an MD-indexed log converted to TVD
 * along the surveyed well), else from --sv as a gradient, else undefined (the model's
 * common-practice default).
 *
 * @param args parsed arguments (--sv). @param s overburden settings. @param inputs from {@link sideInputs}.
 * @returns the profile or undefined.
 * @throws EngineError from verticalStressFromDensityLog / verticalStressFromGradient.
 * @example verticalStressProfile(args, settings, inputs)
 */
export function verticalStressProfile(args: CliArguments, s: Pick<SideInputSettings, 'overburden'>, inputs: ModelSideInputs): VerticalStressProfile | undefined {
  const density = inputs.densityLog;
  if (density) {
    const path = inputs.wellPath;
    const indexToTvd = path && density.log.indexKind !== 'tvd' ? (md: number) => trueVerticalDepthAtMd(path, md) : undefined;
    return verticalStressFromDensityLog(density.log, { ...s.overburden, indexToTvd });
  }
  if (args.sv?.kind === 'gradient') return verticalStressFromGradient(args.sv.value, s.overburden);
  return undefined;
}
