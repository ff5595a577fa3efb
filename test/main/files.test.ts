import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtemp, mkdir, rm, symlink, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { listFolderFiles, readChosenPaths } from '../../src-main/files';

// A temporary folder laid out by this test.

let folder = '';

beforeAll(async () => {
  folder = await mkdtemp(path.join(os.tmpdir(), 'stress-ledger-files-'));
  await mkdir(path.join(folder, 'reports', '2026'), { recursive: true });
  await mkdir(path.join(folder, 'reports', '.hidden'));
  await writeFile(path.join(folder, 'reports', 'hf-1.csv'), 'time,pressure\n0,1\n');
  await writeFile(path.join(folder, 'reports', '2026', 'hf-2.LAS'), '~V\n');
  await writeFile(path.join(folder, 'reports', 'notes.docx'), 'x');
  await writeFile(path.join(folder, 'reports', '.hidden', 'secret.csv'), 'x');
  await symlink('/etc/hostname', path.join(folder, 'reports', 'link.csv'));
});

afterAll(async () => { await rm(folder, { recursive: true, force: true }); });

describe('files', () => {
  it('should list importable files of a folder, skipping hidden entries and other types', async () => {
    expect(await listFolderFiles(path.join(folder, 'reports'))).toEqual(['2026/hf-2.LAS', 'hf-1.csv']);
  });

  it('should read chosen files and folders with their relative paths, and never follow a link', async () => {
    const { files, skipped } = await readChosenPaths([path.join(folder, 'reports'), path.join(folder, 'reports', 'link.csv'), path.join(folder, 'missing.csv')]);
    expect(files.map((f) => f.relativePath)).toEqual(['reports/2026/hf-2.LAS', 'reports/hf-1.csv']);
    expect(new TextDecoder().decode(files[1].bytes)).toBe('time,pressure\n0,1\n');
    expect(skipped.map((s) => path.basename(s.path))).toEqual(['link.csv', 'missing.csv']);
    expect(skipped[0].reason).toBe('not a regular file');
  });
});
