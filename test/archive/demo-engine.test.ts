import 'fake-indexeddb/auto';
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { Archive } from '../../src-renderer/archive/archive';
import { StressLedgerDb } from '../../src-renderer/archive/db';
import { parseDemoManifest, seedDemoArchive } from '../../src-renderer/archive/demo';
import type { ArchiveEngine } from '../../src-renderer/archive/engine-port';
import { importTestFile } from '../../src-renderer/engine/import/import-test-file';
import { analyzeRecord } from '../../src-renderer/engine/analyze';
import { uniqueDatabaseName } from './support/engine';

// The committed demo files of the invented Harrow Flats field, through the real engine:
// the demo manifest (demo/manifest.json, written by the demo generator) states each file's
// well and TVD; the three files in demo/broken must be refused whole.

const demoDirectory = path.resolve('demo');
const engine: ArchiveEngine = {
  parse: (bytes, fileName, options) => importTestFile(bytes, fileName, options),
  analyse: (record, options) => analyzeRecord(record, options),
};

function demoFiles() {
  const manifest = parseDemoManifest(JSON.parse(readFileSync(path.join(demoDirectory, 'manifest.json'), 'utf8')))!;
  const files = manifest.map((entry) => ({ name: entry.file, relativePath: entry.file, bytes: new Uint8Array(readFileSync(path.join(demoDirectory, entry.file))) }));
  return { manifest, files };
}

describe('demo archive with the engine', () => {
  it('should import every demo test, each under its well at its stated depth, and review a few', async () => {
    const archive = await Archive.open({ engine, db: new StressLedgerDb(uniqueDatabaseName()) });
    const { manifest, files } = demoFiles();
    const report = await seedDemoArchive(archive, { loadFiles: async () => ({ files, manifest }) });
    const failures = report.outcomes.filter((o) => o.status !== 'imported');
    expect(failures).toEqual([]);
    const raw = JSON.parse(readFileSync(path.join(demoDirectory, 'manifest.json'), 'utf8')) as { tests: { file: string; well: string; depthTvd: { value: number } }[] };
    const summaries = await archive.listTests();
    expect(summaries).toHaveLength(raw.tests.length);
    for (const test of raw.tests) {
      const summary = summaries.find((s) => s.fileName === test.file)!;
      expect(summary.wellName, test.file).toBe(test.well);
      // Files written in feet round the depth: agreement to 0.05 m is what they carry.
      expect(summary.depthTvd!, test.file).toBeCloseTo(test.depthTvd.value, 1);
    }
    const counts = await archive.countByState();
    expect(counts.accepted).toBeGreaterThan(0);
    expect(counts.rejected).toBe(1);
    expect(counts['in-review']).toBeGreaterThan(0);
    // A test re-opened from the archive re-runs the analysis on the stored samples.
    const detail = await archive.getTest(summaries[0].id);
    expect(detail.analysis.samples).toBe(detail.samples.time.length);
    archive.close();
  });

  it('should refuse each broken demo file with its code and write nothing', async () => {
    const archive = await Archive.open({ engine, db: new StressLedgerDb(uniqueDatabaseName()) });
    const broken = readdirSync(path.join(demoDirectory, 'broken')).sort().map((name) => ({ name, bytes: new Uint8Array(readFileSync(path.join(demoDirectory, 'broken', name))) }));
    const outcomes = await archive.importFiles(broken, 'Maren Holt');
    expect(outcomes.map((o) => o.status)).toEqual(broken.map(() => 'failed'));
    const byName = Object.fromEntries(outcomes.map((o) => [o.fileName, o.error!]));
    expect(byName['non-numeric-cell.csv'].code).toBe('non-numeric-cell');
    expect(byName['non-numeric-cell.csv'].line).toBeGreaterThan(0);
    expect(byName['non-numeric-cell.csv'].column).toBeGreaterThan(0);
    expect(byName['time-backwards.csv'].code).toBe('time-not-increasing');
    expect(byName['unknown-unit.csv'].code).toBe('unknown-unit');
    expect(await archive.db.tests.count()).toBe(0);
    expect(await archive.db.events.count()).toBe(0);
    archive.close();
  });
});
