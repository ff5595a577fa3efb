import { describe, expect, it } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';

// Synthetic archive of five tests whose wells, depths, types and peaks are set here.

async function archiveOfFive() {
  const opened = await openTestArchive();
  const files = [
    simpleFile('1.csv', 'HF-1', { tvd: 1500, peak: 25e6, type: 'fit' }),
    simpleFile('2.csv', 'HF-2', { tvd: 2500, peak: 40e6, type: 'lot' }),
    simpleFile('3.csv', 'HF-10', { tvd: 900, peak: 15e6, type: 'lot', samples: 2 }),
    simpleFile('4.csv', 'HF-3', { peak: 30e6, type: 'xlot' }),
    simpleFile('5.csv', 'Rook-1', { tvd: 3100, peak: 50e6, type: 'dfit', field: 'Cinder Basin' }),
  ];
  const outcomes = await opened.archive.importFiles(files, 'Ana Petrov');
  return { ...opened, ids: outcomes.map((o) => o.testId!) };
}

describe('archive list', () => {
  it('should sort by depth with missing depths last, both directions', async () => {
    const { archive } = await archiveOfFive();
    expect((await archive.listTests({ sortBy: 'depthTvd' })).map((t) => t.depthTvd)).toEqual([900, 1500, 2500, 3100, null]);
    expect((await archive.listTests({ sortBy: 'depthTvd', descending: true })).map((t) => t.depthTvd)).toEqual([3100, 2500, 1500, 900, null]);
  });

  it('should sort well names in natural order', async () => {
    const { archive } = await archiveOfFive();
    expect((await archive.listTests({ sortBy: 'wellName' })).map((t) => t.wellName)).toEqual(['HF-1', 'HF-2', 'HF-3', 'HF-10', 'Rook-1']);
  });

  it('should filter by type, grade, field, state and well text together', async () => {
    const { archive, ids } = await archiveOfFive();
    expect((await archive.listTests({ type: 'lot' })).map((t) => t.wellName).sort()).toEqual(['HF-10', 'HF-2']);
    expect((await archive.listTests({ grade: 'D' })).map((t) => t.wellName)).toEqual(['HF-10']);
    const cinder = (await archive.listFields()).find((f) => f.name === 'Cinder Basin')!;
    expect((await archive.listTests({ fieldId: cinder.id })).map((t) => t.wellName)).toEqual(['Rook-1']);
    expect((await archive.listTests({ wellSearch: 'hf-1' })).map((t) => t.wellName).sort()).toEqual(['HF-1', 'HF-10']);
    await archive.requestReview(ids[1], 'Ana Petrov');
    expect((await archive.listTests({ state: 'in-review', type: 'lot' })).map((t) => t.id)).toEqual([ids[1]]);
    expect(await archive.listTests({ state: 'in-review', type: 'fit' })).toEqual([]);
  });

  it('should count tests per state with and without filters', async () => {
    const { archive, ids } = await archiveOfFive();
    await archive.requestReview(ids[0], 'Ana Petrov');
    await archive.requestReview(ids[1], 'Ana Petrov');
    await archive.signOff(ids[1], 'Ben Osei');
    await archive.reject(ids[2], 'Ben Osei', 'too few samples');
    expect(await archive.countByState()).toEqual({ imported: 2, 'in-review': 1, accepted: 1, rejected: 1, total: 5 });
    expect(await archive.countByState({ type: 'lot' })).toEqual({ imported: 0, 'in-review': 0, accepted: 1, rejected: 1, total: 2 });
  });

  it('should list summaries without metadata or samples', async () => {
    const { archive } = await archiveOfFive();
    const [first] = await archive.listTests();
    expect(first).not.toHaveProperty('metadata');
    expect(first).not.toHaveProperty('source');
    expect(first).not.toHaveProperty('samples');
  });
});

describe('archive list across windows', () => {
  it('should see tests another window of the same archive wrote', async () => {
    const { archive, name, engine } = await openTestArchive();
    expect(await archive.listTests()).toEqual([]);
    const { Archive } = await import('../../src-renderer/archive/archive');
    const { StressLedgerDb } = await import('../../src-renderer/archive/db');
    const other = await Archive.open({ engine, db: new StressLedgerDb(name) });
    const changed = new Promise<void>((resolve) => { const stop = archive.subscribe(() => { stop(); resolve(); }); });
    await other.importFiles([simpleFile('w.csv', 'HF-20')], 'Ben Osei');
    await changed;
    expect((await archive.listTests()).map((t) => t.wellName)).toEqual(['HF-20']);
    other.close();
  });
});
