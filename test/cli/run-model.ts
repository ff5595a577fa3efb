import { runModelCommand } from '../../src-renderer/engine/cli/model-command';

/** Runs the `model` command in-process with captured output. */
export async function runModel(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const code = await runModelCommand(argv, { stdout: (s) => { stdout += s; }, stderr: (s) => { stderr += s; } });
  return { code, stdout, stderr };
}
