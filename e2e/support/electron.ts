import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

/**
 * Where the Electron runtime is, or null when it is not installed (the npm package is
 * present but its binary download never ran, as on machines without network access).
 */
export function electronBinary(): string | null {
  const require = createRequire(import.meta.url);
  try {
    const candidate = require('electron') as unknown;
    if (typeof candidate === 'string' && existsSync(candidate)) return candidate;
  } catch {
    /* the package throws when its binary is missing */
  }
  const dist = path.resolve('node_modules/electron/dist');
  for (const name of ['electron', 'electron.exe', 'Electron.app/Contents/MacOS/Electron']) {
    const file = path.join(dist, name);
    if (existsSync(file)) return file;
  }
  return null;
}

export const ELECTRON_MISSING_MESSAGE =
  'The Electron runtime is not installed on this machine (node_modules/electron has no binary); Electron end-to-end tests are skipped. The same screens are tested in Chromium against the web build.';
