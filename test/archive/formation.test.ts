import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { Archive } from '../../src-renderer/archive/archive';
import { StressLedgerDb } from '../../src-renderer/archive/db';
import type { ArchiveEngine } from '../../src-renderer/archive/engine-port';
import { analyzeRecord } from '../../src-renderer/engine/analyze';
import { importTestFile } from '../../src-renderer/engine/import/import-test-file';
import { uniqueDatabaseName } from './support/engine';

// Synthetic Harrow Flats files (Cobalt Ridge Test Services) through the real engine; the
// formation names are invented and the truth is the name written in each file.

const engine: ArchiveEngine = {
  parse: (bytes, fileName, options) => importTestFile(bytes, fileName, options),
  analyse: (record, options) => analyzeRecord(record, options),
};

function harrowFile(name: string, well: string, tvd: number, formation: string | null) {
  const lines = [
    `Well: ${well}`, 'Field: Harrow Flats', 'Contractor: Cobalt Ridge Test Services', 'Test type: LOT', `TVD (m): ${tvd}`, 'Mud density: 1.20 sg',
    ...(formation ? [`Formation: ${formation}`] : []),
    '', 'Time (s),Pressure (psi),Rate (bbl/min),Volume (bbl)',
  ];
  for (let i = 0; i <= 12; i++) lines.push(`${i * 10},${100 + 150 * Math.min(i, 8)},${i <= 8 ? 0.5 : 0},${(Math.min(i, 8) * 10 * 0.5) / 60}`);
  return { name, relativePath: name, bytes: new TextEncoder().encode(lines.join('\n') + '\n') };
}

describe('formation in archive summaries', () => {
  it('should carry the formation from the metadata into the list summaries, the test detail and a reopened archive', async () => {
    const dbName = uniqueDatabaseName();
    const archive = await Archive.open({ engine, db: new StressLedgerDb(dbName) });
    const outcomes = await archive.importFiles([
      harrowFile('hf3-lot-1200.csv', 'HF-3', 1200, 'Ashgrove Shale'),
      harrowFile('hf3-lot-2250.csv', 'HF-3', 2250, 'Millrace Sandstone'),
      harrowFile('hf5-lot-1000.csv', 'HF-5', 1000, null),
    ], 'Maren Holt');
    expect(outcomes.map((o) => o.status)).toEqual(['imported', 'imported', 'imported']);
    const byFile = new Map((await archive.listTests()).map((s) => [s.fileName, s]));
    expect(byFile.get('hf3-lot-1200.csv')!.formation).toBe('Ashgrove Shale');
    expect(byFile.get('hf3-lot-2250.csv')!.formation).toBe('Millrace Sandstone');
    // A file naming no formation gives a summary without the field (absent, not empty).
    expect('formation' in byFile.get('hf5-lot-1000.csv')!).toBe(false);
    const detail = await archive.getTest(byFile.get('hf3-lot-2250.csv')!.id);
    expect(detail.summary.formation).toBe('Millrace Sandstone');
    expect(detail.metadata.formation).toBe('Millrace Sandstone');
    archive.close();

    // Summaries are derived from the stored metadata: no schema change, the same after reopening.
    const reopened = await Archive.open({ engine, db: new StressLedgerDb(dbName) });
    const again = new Map((await reopened.listTests()).map((s) => [s.fileName, s.formation]));
    expect(again.get('hf3-lot-1200.csv')).toBe('Ashgrove Shale');
    expect(again.get('hf5-lot-1000.csv')).toBeUndefined();
  });
});
