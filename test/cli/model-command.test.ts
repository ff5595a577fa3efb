// The `model` command against contracts/cli.md, on synthetic Harrow Flats files whose truth is
// set here (Shmin = 1 MPa + 16.5 kPa/m x TVD; Cobalt Ridge Test Services layout).
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runModelCommand } from '../../src-renderer/engine/cli/model-command';
import { recordToDelimited } from '../../src-renderer/engine/synthetic/delimited-writer';
import { densityLogToLas } from '../../src-renderer/engine/synthetic/las-writer';
import { generateSyntheticTest } from '../../src-renderer/engine/synthetic/generate';
import type { SyntheticSpec } from '../../src-renderer/engine/synthetic/spec';

const GRADE_ORDER = 'ABCDE';
let dir = '';
const files: string[] = [];

async function run(argv: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await runModelCommand(argv, { stdout: (s) => { stdout += s; }, stderr: (s) => { stderr += s; } });
  return { code, stdout, stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'stress-ledger-model-'));
  const specs: SyntheticSpec[] = [900, 1300, 1700, 2100, 2500].map((z, i) => ({
    type: 'xlot', seed: 10 + i, depthTvd: z, shmin: 1e6 + 16_500 * z, metadata: { well: `HF-${1 + (i % 2)}`, field: 'Harrow Flats' },
  }));
  specs.push({ type: 'xlot', seed: 40, depthTvd: 1500, shmin: 1e6 + 16_500 * 1500, flaws: { leakingShutIn: true, unsteadyRate: true, airInLine: true }, metadata: { well: 'HF-3', field: 'Harrow Flats' } });
  specs.push({ type: 'fit', seed: 41, depthTvd: 1100, shmin: 1e6 + 16_500 * 1100, metadata: { well: 'HF-3', field: 'Harrow Flats' } });
  specs.forEach((spec, i) => {
    const { record } = generateSyntheticTest(spec);
    const path = join(dir, `hf-${i}.csv`);
    writeFileSync(path, recordToDelimited(record, 'comma-psi-bbl'));
    files.push(path);
  });
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('model command', () => {
  it('should print the contract JSON: tests, shminTrend and table with {value, unit} objects', async () => {
    const { code, stdout } = await run(['model', ...files, '--step', '250m', '--from', '500m', '--to', '3000m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc.caution).toMatch(/qualified engineer/);
    expect(doc.tests).toHaveLength(files.length);
    for (const t of doc.tests) {
      expect(Object.keys(t)).toEqual(expect.arrayContaining(['file', 'tvd', 'shmin', 'grade', 'used']));
      expect(t.tvd.unit).toBe('m');
      // --min-grade defaults to B: a test is fitted only when graded A or B and an estimate.
      const eligible = GRADE_ORDER.indexOf(t.grade) <= 1 && t.shmin?.kind === 'estimate';
      expect(t.used).toBe(eligible);
    }
    const fit = doc.tests.find((t: { file: string }) => t.file === 'hf-6.csv');
    // A FIT gives a bound only (METHODS.md): shown, never fitted.
    expect(fit.shmin.kind).not.toBe('estimate');
    expect(fit.used).toBe(false);
    expect(doc.shminTrend.intercept.unit).toBe('MPa');
    expect(doc.shminTrend.gradient.unit).toBe('kPa/m');
    // Truth set above: 16.5 kPa/m and 1 MPa.
    expect(doc.shminTrend.gradient.value).toBeCloseTo(16.5, 0);
    expect(doc.shminTrend.intercept.value).toBeCloseTo(1.0, 0);
    expect(doc.shminTrend.n).toBe(doc.tests.filter((t: { used: boolean }) => t.used).length);
    expect(doc.table.map((r: { tvd: { value: number } }) => r.tvd.value)).toEqual([500, 750, 1000, 1250, 1500, 1750, 2000, 2250, 2500, 2750, 3000]);
    for (const r of doc.table) {
      for (const k of ['shmin', 'shminLow', 'shminHigh', 'sv', 'pp', 'shmaxLow', 'shmaxHigh']) expect(r[k].unit).toBe('MPa');
      expect(r.shminLow.value).toBeLessThan(r.shmin.value);
      expect(r.shminHigh.value).toBeGreaterThan(r.shmin.value);
    }
    // Sv default 1 psi/ft = 22.6206 kPa/m (common practice), Pp hydrostatic 10 kPa/m (common practice).
    expect(doc.table[0].sv.value).toBeCloseTo(0.5 * 22.6206, 3);
    expect(doc.table[0].pp.value).toBeCloseTo(5.0, 6);
  });

  it('should take every estimate with --min-grade E and use stated gradients', async () => {
    const { code, stdout } = await run(['model', ...files, '--min-grade', 'E', '--pp', '0.465psi/ft', '--sv', '1.0psi/ft', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    for (const t of doc.tests) expect(t.used).toBe(t.shmin?.kind === 'estimate');
    // 0.465 psi/ft = 10.5186 kPa/m (psi = 6894.757 Pa, ft = 0.3048 m, NIST SP 811).
    const row = doc.table[0];
    expect(row.pp.value / row.tvd.value * 1000).toBeCloseTo(10.5186, 3);
  });

  it('should fit one line per depth interval with --breaks', async () => {
    const { code, stdout } = await run(['model', ...files, '--min-grade', 'E', '--breaks', '1600m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    // Estimates at 900, 1300, 1500 m above the break and 1700, 2100, 2500 m below it.
    expect(doc.shminTrend.segments.map((s: { name: string; n: number }) => [s.name, s.n])).toEqual([['0-1600 m', 3], ['1600 m and deeper', 3]]);
    // Truth set above: 16.5 kPa/m in both intervals.
    for (const s of doc.shminTrend.segments) {
      expect(s.gradient.unit).toBe('kPa/m');
      expect(Math.abs(s.gradient.value - 16.5)).toBeLessThan(1);
    }
    expect(doc.settings.breaks).toEqual([{ value: 1600, unit: 'm' }]);
  });

  it('should take Sv from a density log with the water column offshore', async () => {
    // Truth set here: constant 2.3 g/cm3 from the mudline; 80 m water at 1025 kg/m3 under a 20 m air gap.
    // Sv(z) = 1025 g 80 + 2300 g (z - 100) for z >= 100 m (hydrostatics, g = 9.80665 m/s2, NIST SP 811).
    const depth = Array.from({ length: 781 }, (_, i) => 100 + 5 * i);
    const las = join(dir, 'hf-density.las');
    writeFileSync(las, densityLogToLas({ depth, density: depth.map(() => 2300), well: 'HF-1', field: 'Harrow Flats' }));
    const { code, stdout } = await run(['model', ...files, '--density-log', las, '--water-depth', '80m', '--rig-floor', '20m', '--step', '500m', '--to', '3000m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    for (const r of doc.table) {
      const z = r.tvd.value;
      expect(r.sv.value).toBeCloseTo((1025 * 9.80665 * 80 + 2300 * 9.80665 * (z - 100)) / 1e6, 4);
      // Hydrostatic 10 kPa/m from sea level (20 m below the rig floor), common practice.
      expect(r.pp.value).toBeCloseTo((10_000 * (z - 20)) / 1e6, 6);
    }
    expect(doc.provenance.join(' ')).toMatch(/hf-density\.las/);
  });

  it('should write a CSV export that reads back to the JSON table', async () => {
    const out = join(dir, 'table.csv');
    const { code, stdout } = await run(['model', ...files, '--step', '500m', '--to', '3000m', '--format', 'csv', '--out', out, '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    const text = readFileSync(out, 'utf8');
    expect(text).toMatch(/well-control policy/);
    const body = text.slice(text.indexOf('\r\n\r\n') + 4);
    const parsed = Papa.parse<Record<string, number>>(body, { header: true, dynamicTyping: true, skipEmptyLines: true });
    expect(parsed.data).toHaveLength(doc.table.length);
    parsed.data.forEach((d, i) => {
      expect(d['TVD [m]']).toBeCloseTo(doc.table[i].tvd.value, 1);
      expect(d['Shmin [MPa]']).toBeCloseTo(doc.table[i].shmin.value, 3);
      expect(d['Sv [MPa]']).toBeCloseTo(doc.table[i].sv.value, 3);
    });
  });

  it('should write an XLSX export in oilfield units', async () => {
    const out = join(dir, 'table.xlsx');
    const { code, stdout } = await run(['model', ...files, '--step', '500m', '--to', '3000m', '--out', out, '--units', 'oilfield', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    const wb = new ExcelJS.Workbook();
    const bytes = readFileSync(out);
    await wb.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    const sheet = wb.getWorksheet('Stress table')!;
    const headers = (sheet.getRow(3).values as unknown[]).slice(1).map(String);
    const col = headers.indexOf('Shmin [psi]') + 1;
    // psi = 6894.757293168 Pa (NIST SP 811).
    expect(sheet.getRow(4).getCell(col).value as number).toBeCloseTo((doc.table[0].shmin.value * 1e6) / 6894.757293168361, 0);
  });

  it('should exit 1 and list the failed file when a file cannot be read', async () => {
    const { code, stdout } = await run(['model', ...files.slice(0, 4), join(dir, 'missing.csv'), '--json']);
    expect(code).toBe(1);
    const doc = JSON.parse(stdout);
    const missing = doc.tests.find((t: { file: string }) => t.file === 'missing.csv');
    expect(missing.error.code).toBe('file-not-found');
    expect(missing.used).toBe(false);
    expect(doc.shminTrend).not.toBeNull();
  });

  it('should print nothing but the JSON document on stdout when run as a program', () => {
    // contracts/cli.md: with --json only the JSON goes to stdout; progress goes to stderr.
    const stdout = execFileSync('npx', ['tsx', 'src-renderer/engine/cli/main.ts', 'model', ...files.slice(0, 5), '--json'], { cwd: process.cwd(), encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    const doc = JSON.parse(stdout);
    expect(doc.tests).toHaveLength(5);
    expect(doc.shminTrend.n).toBeGreaterThanOrEqual(3);
  });

  it('should exit 2 for bad arguments', async () => {
    expect((await run(['model', ...files, '--min-grade', 'Q', '--json'])).code).toBe(2);
    expect((await run(['model', ...files, '--format', 'pdf', '--out', 'x.pdf'])).code).toBe(2);
    expect((await run(['model', ...files, '--step', '-5m'])).code).toBe(2);
    expect((await run(['model', '--json'])).code).toBe(2);
    const help = await run(['model', '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/--min-grade/);
  });
});
