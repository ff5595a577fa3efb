// Where the Electron runtime binary is, or null when the npm package is installed without it
// (its download step cannot run on machines without network access to the release files).
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

export function electronBinary(root = process.cwd()) {
  const require = createRequire(path.join(root, 'package.json'));
  try {
    const candidate = require('electron');
    if (typeof candidate === 'string' && existsSync(candidate)) return candidate;
  } catch {
    // the package throws when its binary is missing
  }
  const dist = path.join(root, 'node_modules/electron/dist');
  for (const name of ['electron', 'electron.exe', 'Electron.app/Contents/MacOS/Electron']) {
    if (existsSync(path.join(dist, name))) return path.join(dist, name);
  }
  return null;
}

/** Run a command, inheriting the terminal; resolves with its exit code. */
export async function run(command, args, options = {}) {
  const { spawn } = await import('node:child_process');
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    const forward = (signal) => { if (child.exitCode === null) child.kill(signal); };
    process.on('SIGINT', forward);
    process.on('SIGTERM', forward);
    child.on('exit', (code, signal) => {
      process.off('SIGINT', forward);
      process.off('SIGTERM', forward);
      resolve(code ?? (signal ? 1 : 0));
    });
  });
}
