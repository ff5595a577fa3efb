/**
 * Peak memory of the command line: after a file is imported its bytes and the import's
 * buffers are garbage, but V8 collects them only when it next needs to, which may be after
 * the analysis has allocated its own arrays, so both sit in memory at once. The command
 * line therefore asks V8 for a full collection between import and analysis (a few
 * milliseconds on its small heap). The collector is reached through V8's --expose-gc flag,
 * set at run time (Node's v8.setFlagsFromString); where that is refused, nothing happens.
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

let collector: (() => void) | null | undefined;

/**
 * Runs a full garbage collection when the runtime allows it; otherwise does nothing.
 * @returns true when a collection ran. @throws nothing.
 * @example collectGarbage(); // after importing a 30 MB file
 */
export function collectGarbage(): boolean {
  if (collector === undefined) {
    try {
      setFlagsFromString('--expose-gc');
      const found: unknown = runInNewContext('typeof gc === "function" ? gc : null');
      collector = typeof found === 'function' ? (found as () => void) : null;
    } catch {
      collector = null;
    }
  }
  if (!collector) return false;
  collector();
  return true;
}
