import { describe, expect, it } from 'vitest';
import { openTestArchive, tableCounts } from './support/open';
import { simpleFile } from './support/engine';
import { sha256HexAsync } from '../../src-renderer/archive/journal/sha256';
import { ArchiveError } from '../../src-renderer/archive/errors';

// Synthetic records: the files, wells and expected rows are set by these tests.

describe('archive import', () => {
  it('should write field, well, test, samples, raw file, grade and events for one file', async () => {
    const { archive } = await openTestArchive();
    const file = simpleFile('hf-3-fit.csv', 'HF-3', { tvd: 1850, peak: 31e6 });
    const [outcome] = await archive.importFiles([file], 'Ana Petrov');
    expect(outcome.status).toBe('imported');
    const counts = await tableCounts(archive);
    expect(counts).toMatchObject({ fields: 1, wells: 1, tests: 1, samples: 1, rawFiles: 1, grades: 1, picks: 0 });
    // field-created, well-created, test-imported
    expect(counts.events).toBe(3);
    const [summary] = await archive.listTests();
    expect(summary).toMatchObject({ wellName: 'HF-3', fieldName: 'Harrow Flats', depthTvd: 1850, shmin: 31e6, state: 'imported', importedBy: 'Ana Petrov' });
    // The hash is Web Crypto's SHA-256 of the raw bytes.
    expect(summary.fileHash).toBe(await sha256HexAsync(file.bytes));
    const raw = await archive.db.rawFiles.get(summary.fileHash);
    expect(Array.from(raw!.bytes)).toEqual(Array.from(file.bytes));
    const samples = await archive.db.samples.get(summary.id);
    expect(samples!.pressure).toBeInstanceOf(Float64Array);
    expect(samples!.pressure.length).toBe(5);
    expect((await archive.listUsers()).map((u) => u.name)).toEqual(['Ana Petrov']);
  });

  it('should report a second copy of the same bytes as a duplicate and write nothing', async () => {
    const { archive } = await openTestArchive();
    const file = simpleFile('a.csv', 'HF-1');
    const [first] = await archive.importFiles([file], 'Ana Petrov');
    const before = await tableCounts(archive);
    const [second] = await archive.importFiles([{ ...file, name: 'renamed-copy.csv' }], 'Ben Osei');
    expect(second).toEqual({ fileName: 'renamed-copy.csv', status: 'duplicate', existingTestId: first.testId });
    expect(await tableCounts(archive)).toEqual(before);
  });

  it('should leave no rows when the analysis of a file fails', async () => {
    const { archive, engine } = await openTestArchive();
    engine.failAnalyseFor = 'bad.csv';
    const [outcome] = await archive.importFiles([simpleFile('bad.csv', 'HF-9')], 'Ana Petrov');
    expect(outcome.status).toBe('failed');
    expect(outcome.error).toMatchObject({ code: 'too-few-points' });
    const counts = await tableCounts(archive);
    for (const table of ['fields', 'wells', 'tests', 'samples', 'rawFiles', 'grades', 'events', 'users']) expect(counts[table]).toBe(0);
  });

  it('should roll back the whole file when a write inside the transaction fails', async () => {
    const { archive } = await openTestArchive();
    archive.db.rawFiles.hook('creating', () => { throw new Error('disk full'); });
    const [outcome] = await archive.importFiles([simpleFile('x.csv', 'HF-2')], 'Ana Petrov');
    expect(outcome.status).toBe('failed');
    expect(outcome.error?.message).toContain('disk full');
    const counts = await tableCounts(archive);
    for (const table of ['fields', 'wells', 'tests', 'samples', 'grades', 'events']) expect(counts[table]).toBe(0);
  });

  it('should report the line and column of an unreadable cell and go on with the next file', async () => {
    const { archive } = await openTestArchive();
    const broken = { name: 'broken.csv', bytes: new TextEncoder().encode('# well: HF-4\n0,1,0,0\n10,abc,0,0\n') };
    const outcomes = await archive.importFiles([broken, simpleFile('ok.csv', 'HF-4')], 'Ana Petrov');
    expect(outcomes[0]).toMatchObject({ status: 'failed', error: { code: 'non-numeric-cell', line: 3, column: 2 } });
    expect(outcomes[1].status).toBe('imported');
    expect((await archive.listTests()).length).toBe(1);
  });

  it('should reuse fields and wells by name, ignoring case and spacing', async () => {
    const { archive } = await openTestArchive();
    await archive.importFiles([
      simpleFile('a.csv', 'HF-5', { field: 'Harrow Flats' }),
      simpleFile('b.csv', 'hf-5 ', { field: 'harrow  flats', peak: 20e6 }),
      simpleFile('c.csv', 'HF-6', { field: 'Harrow Flats', peak: 21e6 }),
    ], 'Ana Petrov');
    expect((await archive.listFields()).map((f) => f.name)).toEqual(['Harrow Flats']);
    expect((await archive.listWells()).map((w) => w.name)).toEqual(['HF-5', 'HF-6']);
  });

  it('should apply metadata overrides and a default well name when the file names none', async () => {
    const { archive } = await openTestArchive();
    const bytes = new TextEncoder().encode('0,1,0,0\n10,2,0,0\n20,3,0,0\n');
    const [outcome] = await archive.importFiles([{ name: 'HF-7 shoe test.csv', bytes }], 'Ana Petrov', { overrides: { depthTvd: 1200 as never } });
    const detail = await archive.getTest(outcome.testId!);
    expect(detail.summary.wellName).toBe('HF-7 shoe test');
    expect(detail.summary.fieldName).toBe('Unassigned field');
    expect(detail.summary.depthTvd).toBe(1200);
  });

  it('should report progress per file and refuse an empty user name', async () => {
    const { archive } = await openTestArchive();
    const seen: number[] = [];
    await archive.importFiles([simpleFile('a.csv', 'A'), simpleFile('b.csv', 'B', { peak: 2e7 })], 'Ana', { onProgress: (done) => seen.push(done) });
    expect(seen).toEqual([1, 2]);
    await expect(archive.importFiles([], '  ')).rejects.toBeInstanceOf(ArchiveError);
  });
});
