/**
 * Entry point of the command line (`npm run cli -- ...`): runs the dispatcher on the
 * process arguments and sets the exit status. See run-cli.ts and contracts/cli.md.
 */
import { runCli } from './run-cli';

process.exitCode = await runCli(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr });
