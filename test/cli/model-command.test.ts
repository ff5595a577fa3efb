// The `model` command against contracts/cli.md, on synthetic Harrow Flats files whose truth is
// set here (Shmin = 1 MPa + 16.5 kPa/m x TVD; Cobalt Ridge Test Services layout).
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runModel } from './run-model';
import { recordToDelimited } from '../../src-renderer/engine/synthetic/delimited-writer';
import { densityLogToLas } from '../../src-renderer/engine/synthetic/las-writer';
import { generateSyntheticTest } from '../../src-renderer/engine/synthetic/generate';
import type { SyntheticSpec } from '../../src-renderer/engine/synthetic/spec';

const GRADE_ORDER = 'ABCDE';
let dir = '';
const files: string[] = [];


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
    const { code, stdout } = await runModel(['model', ...files, '--step', '250m', '--from', '500m', '--to', '3000m', '--json']);
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
    const { code, stdout } = await runModel(['model', ...files, '--min-grade', 'E', '--pp', '0.465psi/ft', '--sv', '1.0psi/ft', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    for (const t of doc.tests) expect(t.used).toBe(t.shmin?.kind === 'estimate');
    // 0.465 psi/ft = 10.5186 kPa/m (psi = 6894.757 Pa, ft = 0.3048 m, NIST SP 811).
    const row = doc.table[0];
    expect(row.pp.value / row.tvd.value * 1000).toBeCloseTo(10.5186, 3);
  });

  it('should fit one line per depth interval with --breaks', async () => {
    const { code, stdout } = await runModel(['model', ...files, '--min-grade', 'E', '--breaks', '1600m', '--json']);
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
    const { code, stdout } = await runModel(['model', ...files, '--density-log', las, '--water-depth', '80m', '--rig-floor', '20m', '--step', '500m', '--to', '3000m', '--json']);
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
    const { code, stdout } = await runModel(['model', ...files, '--step', '500m', '--to', '3000m', '--format', 'csv', '--out', out, '--json']);
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
    const { code, stdout } = await runModel(['model', ...files, '--step', '500m', '--to', '3000m', '--out', out, '--units', 'oilfield', '--json']);
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
    const { code, stdout } = await runModel(['model', ...files.slice(0, 4), join(dir, 'missing.csv'), '--json']);
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
    expect((await runModel(['model', ...files, '--min-grade', 'Q', '--json'])).code).toBe(2);
    expect((await runModel(['model', ...files, '--format', 'pdf', '--out', 'x.pdf'])).code).toBe(2);
    expect((await runModel(['model', ...files, '--step', '-5m'])).code).toBe(2);
    expect((await runModel(['model', '--json'])).code).toBe(2);
    const help = await runModel(['model', '--help']);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/--min-grade/);
  });
});

describe('model command inputs besides the tests', () => {
  const SURVEY = join(process.cwd(), 'demo', 'HF-3_survey.csv');
  /** Demo HF-3 profile (demo/manifest.json): vertical to 800 m, build 2 deg/30 m to 35 deg at 1325 m MD, hold. */
  const radius = 30 / ((2 * Math.PI) / 180);
  const tvdEndOfBuild = 800 + radius * Math.sin((35 * Math.PI) / 180);
  /** MD at a TVD on the hold (build-and-hold geometry, Bourgoyne et al., Applied Drilling Engineering 1986, ch. 8; from memory). */
  const mdOnHold = (tvd: number) => 1325 + (tvd - tvdEndOfBuild) / Math.cos((35 * Math.PI) / 180);

  it('should add the MD column of the surveyed well with --survey and --well', async () => {
    const { code, stdout } = await runModel(['model', ...files, '--survey', SURVEY, '--well', 'HF-3', '--step', '250m', '--to', '3000m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc.settings.survey).toMatchObject({ file: 'HF-3_survey.csv', well: 'HF-3', from: 'option', stations: 134 });
    const at = (z: number) => doc.table.find((r: { tvd: { value: number } }) => r.tvd.value === z);
    // Vertical above the kick-off: MD = TVD.
    expect(at(500).md).toEqual({ value: 500, unit: 'm' });
    // On the hold the stations are listed to 0.01 deg with the end of build between stations: 0.1 m.
    for (const z of [1500, 2000, 3000]) expect(Math.abs(at(z).md.value - mdOnHold(z))).toBeLessThan(0.1);
    expect(doc.provenance.join(' ')).toMatch(/minimum curvature/);
  });

  it('should convert an MD-indexed density log to TVD with the survey', async () => {
    // Truth set here: 2.3 g/cm3 everywhere below the ground at the rig floor, so Sv = 2300 g TVD
    // (hydrostatics, g = 9.80665 m/s2) whatever the path; the log is indexed by MD (DEPT, no DREF).
    const lines = ['~V', ' VERS. 2.0 : CWLS LOG ASCII STANDARD', ' WRAP. NO :', '~W', ' NULL. -999.25 :', ' WELL. HF-3 : WELL', '~C', ' DEPT.M : MEASURED DEPTH', ' RHOB.G/C3 : BULK DENSITY', '~A'];
    for (let md = 0; md <= 4000; md += 10) lines.push(`${md} 2.3`);
    const las = join(dir, 'hf-3-md-density.las');
    writeFileSync(las, lines.join('\n'));
    const { code, stdout } = await runModel(['model', ...files, '--survey', SURVEY, '--density-log', las, '--step', '500m', '--to', '3000m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc.provenance.join(' ')).toMatch(/converted to TVD with the well survey/);
    for (const r of doc.table) expect(r.sv.value).toBeCloseTo((2300 * 9.80665 * r.tvd.value) / 1e6, 3);
  });

  it('should take a survey and a density log found among the FILEs, say so on stderr and exit 0', async () => {
    // Truth set here: constant 2.2 g/cm3 below a vertical ground level at the rig floor; Sv = 2200 g z.
    const depth = Array.from({ length: 701 }, (_, i) => 5 * i);
    const las = join(dir, 'hf-3-density.las');
    writeFileSync(las, densityLogToLas({ depth, density: depth.map(() => 2200), well: 'HF-3', field: 'Harrow Flats' }));
    const { code, stdout, stderr } = await runModel(['model', ...files, SURVEY, las, '--step', '500m', '--to', '3000m', '--json']);
    expect(code).toBe(0);
    expect(stderr).toMatch(/HF-3_survey\.csv is a directional survey, not a test/);
    expect(stderr).toMatch(/hf-3-density\.las is a depth log, not a test/);
    const doc = JSON.parse(stdout);
    expect(doc.tests).toHaveLength(files.length);
    expect(doc.inputs).toEqual([
      { file: 'HF-3_survey.csv', role: 'survey', used: true, error: null },
      { file: 'hf-3-density.las', role: 'density-log', used: true, error: null },
    ]);
    expect(doc.settings.survey.well).toBe('HF-3');
    const row = doc.table.find((r: { tvd: { value: number } }) => r.tvd.value === 2000);
    expect(Math.abs(row.md.value - mdOnHold(2000))).toBeLessThan(0.1);
    // Hydrostatics Sv = rho g z (g = 9.80665 m/s2, NIST SP 811); the log is indexed by TVD, so the survey does not convert it.
    expect(row.sv.value).toBeCloseTo((2200 * 9.80665 * 2000) / 1e6, 3);
  });

  it('should exit 1 and list a survey among the FILEs whose MD does not increase', async () => {
    const bad = join(dir, 'bad-survey.csv');
    writeFileSync(bad, 'Well,HF-3\nMD (m),Inclination (deg),Azimuth (deg)\n0,0,0\n100,1,10\n90,2,10\n');
    const { code, stdout } = await runModel(['model', ...files, bad, '--json']);
    expect(code).toBe(1);
    const doc = JSON.parse(stdout);
    expect(doc.inputs[0]).toMatchObject({ file: 'bad-survey.csv', role: 'survey', used: false, error: { code: 'bad-survey', file: 'bad-survey.csv', line: 5, column: 1 } });
  });

  it('should run Pp through the measurements of the chosen well with --pp-points', async () => {
    // Truth set here: HF-1 overpressured, 10.5 MPa at 1000 m and 23.0 MPa at 2000 m TVD (3.0 MPa at 300 m for HF-2).
    const pp = join(dir, 'pp-points.csv');
    writeFileSync(pp, 'Field,Harrow Flats\n\nWell;TVD (ft);Pp (MPa)\n'.replace(/,/g, ';') + 'HF-1;3280,84;10,5\nHF-1;6561,68;23\nHF-2;984,252;3\n');
    const { code, stdout } = await runModel(['model', ...files, '--pp-points', pp, '--well', 'HF-1', '--step', '500m', '--to', '3000m', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout);
    expect(doc.settings.porePressureSource).toBe('measurements');
    expect(doc.settings.porePressurePoints).toEqual({ file: 'pp-points.csv', well: 'HF-1', count: 2 });
    const at = (z: number) => doc.table.find((r: { tvd: { value: number } }) => r.tvd.value === z).pp.value;
    // 3280.84 ft = 1000.000 m (international foot 0.3048 m, NIST SP 811): straight lines from 0 at the rig floor.
    expect(at(500)).toBeCloseTo(5.25, 3);
    expect(at(1500)).toBeCloseTo(16.75, 3);
    // Below the deepest point: 23 MPa + 10 kPa/m (the hydrostatic default, common practice).
    expect(at(3000)).toBeCloseTo(33, 3);
    // Several wells in the file and none chosen: bad arguments.
    expect((await runModel(['model', ...files, '--pp-points', pp, '--json'])).code).toBe(2);
  });

  it('should exit 0 with only the JSON on stdout when run as a program with a survey among the FILEs', () => {
    // contracts/cli.md: with --json only the JSON goes to stdout; the note goes to stderr.
    const stdout = execFileSync('npx', ['tsx', 'src-renderer/engine/cli/main.ts', 'model', ...files.slice(0, 5), SURVEY, '--step', '500m', '--json'], { cwd: process.cwd(), encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    const doc = JSON.parse(stdout);
    expect(doc.tests).toHaveLength(5);
    expect(doc.inputs).toEqual([{ file: 'HF-3_survey.csv', role: 'survey', used: true, error: null }]);
    expect(doc.table.some((r: { md?: unknown }) => r.md !== undefined)).toBe(true);
  });

  it('should print the MD column in the text summary', async () => {
    const { code, stdout } = await runModel(['model', ...files, '--survey', SURVEY, '--step', '500m', '--to', '3000m']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/TVD m\s+MD m/);
    expect(stdout).toMatch(/^\s+500\s+500\.0\s/m);
  });

  it('should document the survey, well and pore-pressure options in --help', async () => {
    const help = await runModel(['model', '--help']);
    for (const word of ['--survey FILE', '--well NAME', '--pp-points FILE', 'density log']) expect(help.stdout).toContain(word);
  });
});
