/**
 * Where the published reference data live (NIST StRD, ISCWSA well paths, NIST SP 811
 * factors, the LAS corpus; see SOURCES.md there): the `shared/reference` folder beside
 * the repository, or the folder named by STRESS_LEDGER_REFERENCE.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const repositoryRoot = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');

function referenceFolder(): string {
  const candidates = [
    process.env.STRESS_LEDGER_REFERENCE,
    join(repositoryRoot, '..', 'shared', 'reference'),
    join(repositoryRoot, 'shared', 'reference'),
  ].filter((p): p is string => typeof p === 'string' && p.length > 0);
  const found = candidates.find((p) => existsSync(p));
  if (!found) {
    throw new Error(`The reference data folder was not found; looked in ${candidates.join(', ')}. Set STRESS_LEDGER_REFERENCE to its path.`);
  }
  return found;
}

/** Absolute path of the reference data folder. */
export const REFERENCE_DIR = referenceFolder();

/** Absolute path of a file or folder inside the reference data. */
export function referencePath(...parts: string[]): string {
  return join(REFERENCE_DIR, ...parts);
}

/** Rows of a comma-separated reference file (first line the header), as header -> text. */
export function readReferenceRows(...parts: string[]): Record<string, string>[] {
  const [header, ...lines] = readFileSync(referencePath(...parts), 'utf8').trim().split(/\r?\n/);
  const names = header.split(',');
  return lines.map((l) => Object.fromEntries(l.split(',').map((v, i) => [names[i], v])));
}

/** Rows grouped by a key, in their order. */
export function groupBy<T>(rows: T[], key: (r: T) => string): Map<string, T[]> {
  const m = new Map<string, T[]>();
  for (const r of rows) m.set(key(r), [...(m.get(key(r)) ?? []), r]);
  return m;
}
