/**
 * The command line's dispatcher: `analyze`, `model` (in model-command.ts, loaded on
 * demand; it receives the whole argument list, "model" included) and `--help`. Exit status per contracts/cli.md: 0 every file analysed, 1 any
 * file could not be read or understood, 2 bad arguments.
 */
import { EngineError, isEngineError } from '../errors';
import packageJson from '../../../package.json' with { type: 'json' };
import { analyzeFilesForCli, type TextSink } from './analyze-files';
import { SAFETY_CAUTION } from './caution';
import { analyzeDocument, errorJson, TOOL_NAME } from './json-output';
import { parseCliArguments } from './options';
import { fileSummaryText } from './text-output';

/** Where the command line writes. */
export interface CliIo {
  stdout: TextSink;
  stderr: TextSink;
}

/** The program's version (package.json). */
export const TOOL_VERSION: string = (packageJson as { version: string }).version;

/** Usage text of `--help`. */
export const USAGE = `Stress Ledger command line: analyse borehole pressure tests (FIT, LOT, XLOT, SRT, DFIT).

Usage:
  cli analyze FILE [FILE ...] [options] [--json]
  cli model FILE [FILE ...] [options] [--json]     (regional stress model; see "cli model --help")
  cli --help

Options (values take a unit; without one the SI display unit is assumed):
  --type fit|lot|xlot|srt|dfit     test type; inferred from the record when absent
  --tvd VALUE[UNIT]                TVD of the tested interval, e.g. 1520m, 4987ft
  --mud VALUE[UNIT]                density of the fluid column, e.g. 1.25sg, 10.4ppg, 1250kg/m3
  --gauge surface|downhole         where the pressure was measured (default: file, else surface)
  --pp VALUE[UNIT]                 pore pressure at test depth (21.3MPa) or a gradient (10.2kPa/m, 0.45psi/ft)
  --sv VALUE[UNIT]                 vertical stress at test depth, or a gradient
  --system-volume VALUE[UNIT]      fluid volume under compression, e.g. 62m3, 390bbl
  --compressibility VALUE[UNIT]    its effective compressibility, e.g. 5e-10/Pa, 3.4e-6/psi
  --json                           print only the JSON document on stdout (progress goes to stderr)
  --help, -h                       this text

A value given here wins over the same value found in the file. Every pressure reported
is the downhole value at the tested depth, in MPa.

Exit status: 0 every file analysed (whatever its grade), 1 a file could not be read or
understood, 2 bad arguments.

${SAFETY_CAUTION}
`;

/**
 * Runs the command line.
 *
 * @param argv arguments after the program name. @param io stdout and stderr sinks.
 * @returns the exit status (0, 1 or 2).
 * @example process.exitCode = await runCli(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr });
 */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const wantsJson = argv.includes('--json');
  const command = argv.find((a) => !a.startsWith('-')) ?? null;
  if (command === 'model') return runModel([...argv], io);
  try {
    const args = parseCliArguments(argv);
    if (argv.length === 0) {
      io.stderr.write(USAGE);
      return 2;
    }
    if (args.help) {
      io.stdout.write(USAGE);
      return 0;
    }
    if (args.command !== 'analyze') {
      throw new EngineError('bad-argument', args.command === null ? 'no command given' : `unknown command "${args.command}"`, {}, 'analyze or model');
    }
    if (args.files.length === 0) throw new EngineError('bad-argument', 'no file to analyse', {}, 'one or more file paths after "analyze"');
    const texts: string[] = [];
    const outcomes = await analyzeFilesForCli(args.files, args, {
      stderr: io.stderr,
      release: true,
      onOutcome: args.json ? undefined : (o) => texts.push(fileSummaryText(o)),
    });
    if (args.json) io.stdout.write(JSON.stringify(analyzeDocument(TOOL_VERSION, outcomes.map((o) => o.json)), null, 2) + '\n');
    else io.stdout.write(texts.join('\n') + `\n${SAFETY_CAUTION}\n`);
    return outcomes.some((o) => o.error) ? 1 : 0;
  } catch (e) {
    return badArguments(e, wantsJson, io);
  }
}

/** Writes a bad-argument failure (stderr; and a JSON document on stdout with --json) and returns 2. */
export function badArguments(e: unknown, wantsJson: boolean, io: CliIo): number {
  const error = isEngineError(e) ? e : new EngineError('internal-error', e instanceof Error ? e.message : String(e));
  io.stderr.write(`error: ${error.message}\nRun with --help for usage.\n`);
  if (wantsJson) {
    io.stdout.write(JSON.stringify({ tool: { name: TOOL_NAME, version: TOOL_VERSION }, caution: SAFETY_CAUTION, error: errorJson(error) }, null, 2) + '\n');
  }
  return isEngineError(e) ? 2 : 1;
}

interface ModelModule {
  runModelCommand(argv: string[], io: CliIo): Promise<number>;
}

async function runModel(rest: string[], io: CliIo): Promise<number> {
  let module: ModelModule;
  try {
    module = (await import('./model-command')) as ModelModule;
  } catch (e) {
    io.stderr.write(`error: the model command is not available in this build (${e instanceof Error ? e.message : String(e)})\n`);
    return 2;
  }
  if (typeof module.runModelCommand !== 'function') {
    io.stderr.write('error: the model command is not available in this build (runModelCommand missing)\n');
    return 2;
  }
  return module.runModelCommand(rest, io);
}
