import { lstat, readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import type { PickedFile } from '../src-renderer/bridge/types';
import { MAXIMUM_FILE_BYTES, MAXIMUM_FILES } from './ipc-schemas';

/**
 * Reading the files the user chose (dialog, drop, recent list) for the renderer. Only
 * regular files are read (no symbolic links, devices or sockets), each at most
 * MAXIMUM_FILE_BYTES; folders are walked to MAXIMUM_FOLDER_DEPTH, skipping hidden entries,
 * keeping only importable extensions.
 */

export const IMPORTABLE_EXTENSIONS = ['.csv', '.tsv', '.txt', '.dat', '.xlsx', '.las'];
export const MAXIMUM_FOLDER_DEPTH = 8;

/** Read the given files; a folder among them is walked. Skips what cannot be read, and says why. */
export async function readChosenPaths(paths: readonly string[]): Promise<{ files: PickedFile[]; skipped: { path: string; reason: string }[] }> {
  const files: PickedFile[] = [];
  const skipped: { path: string; reason: string }[] = [];
  for (const chosen of paths) {
    if (files.length >= MAXIMUM_FILES) { skipped.push({ path: chosen, reason: `more than ${MAXIMUM_FILES} files` }); continue; }
    try {
      const info = await lstat(chosen);
      if (info.isDirectory()) {
        const inFolder = await listFolderFiles(chosen);
        for (const relative of inFolder) {
          if (files.length >= MAXIMUM_FILES) break;
          const full = path.join(chosen, ...relative.split('/'));
          const file = await readRegularFile(full, `${path.basename(chosen)}/${relative}`);
          if ('reason' in file) skipped.push({ path: full, reason: file.reason }); else files.push(file);
        }
      } else {
        const file = await readRegularFile(chosen, path.basename(chosen));
        if ('reason' in file) skipped.push({ path: chosen, reason: file.reason }); else files.push(file);
      }
    } catch (error) {
      skipped.push({ path: chosen, reason: (error as Error).message });
    }
  }
  return { files, skipped };
}

async function readRegularFile(fullPath: string, relativePath: string): Promise<PickedFile | { reason: string }> {
  const info = await lstat(fullPath);
  if (!info.isFile()) return { reason: 'not a regular file' };
  if (info.size > MAXIMUM_FILE_BYTES) return { reason: `larger than ${MAXIMUM_FILE_BYTES} bytes` };
  const bytes = new Uint8Array(await readFile(fullPath));
  return { name: path.basename(fullPath), relativePath, bytes };
}

/**
 * Importable files inside a folder, as '/'-separated paths relative to it, sorted.
 *
 * @param folder absolute folder path
 * @example listFolderFiles('/data/hf-reports') // ['2025/hf-3-fit.csv', 'hf-1-lot.xlsx']
 */
export async function listFolderFiles(folder: string, depth = 0, prefix = ''): Promise<string[]> {
  if (depth > MAXIMUM_FOLDER_DEPTH) return [];
  const entries = await readdir(folder, { withFileTypes: true });
  const out: string[] = [];
  for (const entry of entries.sort((a, b) => a.name.localeCompare(b.name))) {
    if (entry.name.startsWith('.')) continue;
    const relative = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) out.push(...(await listFolderFiles(path.join(folder, entry.name), depth + 1, relative)));
    else if (entry.isFile() && IMPORTABLE_EXTENSIONS.includes(path.extname(entry.name).toLowerCase())) out.push(relative);
    if (out.length >= MAXIMUM_FILES) break;
  }
  return out.slice(0, MAXIMUM_FILES);
}
