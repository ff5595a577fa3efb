/**
 * Command-line options shared by `analyze` and `model` (contracts/cli.md): parsing of the
 * argument list and the per-file analysis options built from it. Values carry units and
 * are read with parseQuantity; --pp and --sv accept a pressure or a gradient (a gradient
 * is multiplied by the TVD of each file, from --tvd or from the file).
 */
import type { AnalysisOptions } from '../analysis-options';
import { EngineError } from '../errors';
import { TEST_TYPES, type GaugePosition, type TestMetadata, type TestType } from '../record';
import type { KilogramPerCubicMetre, Metre, CubicMetre, PerPascal, Pascal } from '../units/quantity';
import { parseQuantity } from '../units/parseQuantity';

/** A pressure or a gradient as given for --pp / --sv. */
export type PressureOrGradient = { kind: 'pressure'; value: number } | { kind: 'gradient'; value: number };

/** Parsed command line. Values are SI. */
export interface CliArguments {
  /** First word: the command, or null when none was given. */
  command: string | null;
  files: string[];
  json: boolean;
  help: boolean;
  type?: TestType;
  gauge?: GaugePosition;
  /** m */
  tvd?: number;
  /** kg/m3 */
  mud?: number;
  /** m3 */
  systemVolume?: number;
  /** 1/Pa */
  compressibility?: number;
  pp?: PressureOrGradient;
  sv?: PressureOrGradient;
  /** Values of command-specific options (e.g. model's --min-grade), as written, by name without dashes. */
  extra: Record<string, string>;
}

/** Options every command understands, each taking a value. */
export const VALUE_OPTIONS = ['type', 'tvd', 'mud', 'gauge', 'pp', 'sv', 'system-volume', 'compressibility'] as const;

/**
 * Parses `COMMAND FILE... [options]`. Options: `--name value` or `--name=value`; flags
 * `--json`, `--help`/`-h`. `extraOptions` names further value options of a command.
 *
 * @param argv arguments after the program name (e.g. process.argv.slice(2)).
 * @param extraOptions names (without dashes) of command-specific value options.
 * @returns the parsed arguments, values in SI.
 * @throws EngineError 'bad-argument' for an unknown option, a missing value, an unknown type
 *   or gauge; 'unknown-unit' / 'bad-argument' from parseQuantity for a bad value.
 * @example parseCliArguments(['analyze', 'a.csv', '--tvd', '1520m', '--json']).tvd // 1520
 */
export function parseCliArguments(argv: readonly string[], extraOptions: readonly string[] = []): CliArguments {
  const out: CliArguments = { command: null, files: [], json: false, help: false, extra: {} };
  const known = new Set<string>([...VALUE_OPTIONS, ...extraOptions]);
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--json') { out.json = true; continue; }
    if (arg === '--help' || arg === '-h') { out.help = true; continue; }
    if (arg === '--') { out.files.push(...argv.slice(i + 1)); break; }
    if (!arg.startsWith('-') || arg === '-') {
      if (out.command === null) out.command = arg;
      else out.files.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq >= 0 ? eq : undefined);
    if (!arg.startsWith('--') || !known.has(name)) {
      throw new EngineError('bad-argument', `unknown option "${arg}"`, {}, `one of --json, --help, ${[...known].map((k) => `--${k}`).join(', ')}`);
    }
    let value: string;
    if (eq >= 0) value = arg.slice(eq + 1);
    else {
      if (i + 1 >= argv.length) throw new EngineError('bad-argument', `option --${name} needs a value`, {}, `--${name} VALUE`);
      value = argv[++i];
    }
    if (value === '') throw new EngineError('bad-argument', `option --${name} has an empty value`, {}, `--${name} VALUE`);
    setOption(out, name, value);
  }
  return out;
}

function setOption(out: CliArguments, name: string, value: string): void {
  const where = { file: `--${name}` };
  switch (name) {
    case 'type': {
      const t = value.toLowerCase() as TestType;
      if (!TEST_TYPES.includes(t)) throw new EngineError('bad-argument', `unknown test type "${value}"`, {}, TEST_TYPES.join(', '));
      out.type = t;
      return;
    }
    case 'gauge': {
      const g = value.toLowerCase();
      if (g !== 'surface' && g !== 'downhole') throw new EngineError('bad-argument', `unknown gauge position "${value}"`, {}, 'surface or downhole');
      out.gauge = g;
      return;
    }
    case 'tvd': out.tvd = positive(parseQuantity(value, 'length', where).value, name); return;
    case 'mud': out.mud = positive(parseQuantity(value, 'density', where).value, name); return;
    case 'system-volume': out.systemVolume = positive(parseQuantity(value, 'volume', where).value, name); return;
    case 'compressibility': out.compressibility = positive(parseQuantity(value, 'compressibility', where).value, name); return;
    case 'pp':
    case 'sv': {
      const q = parseQuantity(value, 'pressureOrGradient', where);
      const v = positive(q.value, name);
      out[name] = q.dimension === 'pressure' ? { kind: 'pressure', value: v } : { kind: 'gradient', value: v };
      return;
    }
    default:
      out.extra[name] = value;
  }
}

function positive(value: number, name: string): number {
  if (!Number.isFinite(value) || value <= 0) {
    throw new EngineError('bad-argument', `option --${name} must be a positive value, got ${value}`, {}, 'a value above 0 with its unit');
  }
  return value;
}

/**
 * The analysis options for one file: command-line values as overrides (they win over the
 * file's metadata). A --pp or --sv gradient becomes a pressure at the file's TVD.
 *
 * @param args parsed arguments. @param fileMetadata the imported record's metadata (for its TVD).
 * @param fileName for errors.
 * @returns AnalysisOptions with type and overrides.
 * @throws EngineError 'bad-metadata' when a gradient is given but no TVD is known.
 * @example analysisOptionsFor(args, record.metadata, 'a.csv').overrides?.depthTvd
 */
export function analysisOptionsFor(args: CliArguments, fileMetadata: TestMetadata, fileName: string): AnalysisOptions {
  const overrides: Partial<TestMetadata> = {};
  if (args.tvd !== undefined) overrides.depthTvd = args.tvd as Metre;
  if (args.mud !== undefined) overrides.mudDensity = args.mud as KilogramPerCubicMetre;
  if (args.gauge !== undefined) overrides.gaugePosition = args.gauge;
  if (args.systemVolume !== undefined) overrides.systemVolume = args.systemVolume as CubicMetre;
  if (args.compressibility !== undefined) overrides.compressibility = args.compressibility as PerPascal;
  const tvd = args.tvd ?? fileMetadata.depthTvd;
  const atDepth = (given: PressureOrGradient, what: string): Pascal => {
    if (given.kind === 'pressure') return given.value as Pascal;
    if (tvd === undefined) {
      throw new EngineError('bad-metadata', `${what} was given as a gradient but the TVD is not known`, { file: fileName }, 'a TVD in the file or --tvd');
    }
    return (given.value * tvd) as Pascal;
  };
  if (args.pp) overrides.porePressure = atDepth(args.pp, 'the pore pressure (--pp)');
  if (args.sv) overrides.verticalStress = atDepth(args.sv, 'the vertical stress (--sv)');
  return { ...(args.type ? { type: args.type } : {}), overrides };
}
