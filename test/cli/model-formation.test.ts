// The `model --by-formation` option on synthetic Harrow Flats files (Cobalt Ridge Test
// Services layout) whose truth is set here: two invented formations with their own Shmin
// lines, and one test that names no formation.
import Papa from 'papaparse';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runModel } from './run-model';
import { recordToDelimited } from '../../src-renderer/engine/synthetic/delimited-writer';
import { generateSyntheticTest } from '../../src-renderer/engine/synthetic/generate';

let dir = '';
const files: string[] = [];
// Truth set here: Ashgrove Shale Shmin = 1 MPa + 16.5 kPa/m x TVD; Millrace Sandstone 4 MPa + 15.0 kPa/m x TVD.
const SHALE = { name: 'Ashgrove Shale', intercept: 1e6, gradient: 16_500, depths: [800, 1000, 1200, 1400] };
const SAND = { name: 'Millrace Sandstone', intercept: 4e6, gradient: 15_000, depths: [1900, 2200, 2500, 2800] };


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'stress-ledger-formation-'));
  let seed = 60;
  const write = (name: string, tvd: number, shmin: number, formation: string | null) => {
    seed += 1;
    const { record } = generateSyntheticTest({
      type: 'xlot', seed, depthTvd: tvd, shmin,
      metadata: { well: `HF-${1 + (seed % 2)}`, field: 'Harrow Flats', ...(formation ? { extra: { Formation: formation } } : {}) },
    });
    const path = join(dir, name);
    writeFileSync(path, recordToDelimited(record, 'comma-psi-bbl'));
    files.push(path);
  };
  for (const f of [SHALE, SAND]) for (const z of f.depths) write(`hf-${z}.csv`, z, f.intercept + f.gradient * z, f.name);
  write('hf-1650-unnamed.csv', 1650, 1e6 + 16_500 * 1650, null);
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('model command by formation', () => {
  it('should fit one Shmin line per formation named in the files and state the unnamed group', async () => {
    const { code, stdout, stderr } = await runModel(['model', ...files, '--min-grade', 'E', '--by-formation', '--step', '100m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc.settings.byFormation).toBe(true);
    const segments = doc.shminTrend.segments as { name: string; n: number; gradient: { value: number }; intercept: { value: number } }[];
    expect(segments.map((s) => [s.name, s.n])).toEqual([[SHALE.name, 4], [SAND.name, 4]]);
    // Each line recovers its own truth (set above) within the scatter of the synthetic picks.
    expect(Math.abs(segments[0].gradient.value - 16.5)).toBeLessThan(1);
    expect(Math.abs(segments[1].gradient.value - 15.0)).toBeLessThan(1);
    // The test without a formation forms the "unnamed" group: one test gives no line, and both are stated.
    const unnamed = doc.tests.find((t: { file: string }) => t.file === 'hf-1650-unnamed.csv');
    expect(unnamed.formation).toBeNull();
    expect(unnamed.used).toBe(false);
    expect(unnamed.reason).toMatch(/unnamed/);
    expect(stderr).toMatch(/1 test carries no formation name: fitted together as "unnamed"/);
    expect(doc.provenance.join(' ')).toMatch(/No trend for unnamed/);
    expect(doc.tests.find((t: { file: string }) => t.file === 'hf-1200.csv').formation).toBe(SHALE.name);
    // Table rows name the line they use: the shale above the meeting depth, the sandstone below.
    const rowAt = (z: number) => doc.table.find((r: { tvd: { value: number } }) => r.tvd.value === z);
    expect(rowAt(1000).segment).toBe(SHALE.name);
    expect(rowAt(2500).segment).toBe(SAND.name);
  });

  it('should state the trend line of each row in the CSV export', async () => {
    const out = join(dir, 'by-formation.csv');
    const { code } = await runModel(['model', ...files, '--min-grade', 'E', '--by-formation', '--step', '500m', '--out', out]);
    expect(code).toBe(0);
    const text = readFileSync(out, 'utf8');
    expect(text).toMatch(/qualified engineer/);
    const rows = Papa.parse<string[]>(text.trim()).data;
    const header = rows.find((r) => r.includes('Trend line'))!;
    const col = header.indexOf('Trend line');
    const tvdCol = header.findIndex((h) => /^TVD/.test(h));
    const body = rows.slice(rows.indexOf(header) + 1).filter((r) => r.length === header.length);
    const lineAt = (z: number) => body.find((r) => Number(r[tvdCol]) === z)![col];
    expect(lineAt(1000)).toBe(SHALE.name);
    expect(lineAt(2500)).toBe(SAND.name);
  });

  it('should refuse --by-formation together with --breaks', async () => {
    const { code, stderr } = await runModel(['model', ...files, '--by-formation', '--breaks', '1600m']);
    expect(code).toBe(2);
    expect(stderr).toMatch(/--by-formation and --breaks/);
  });
});
