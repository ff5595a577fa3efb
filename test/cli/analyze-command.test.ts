import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCliArguments } from '../../src-renderer/engine/cli/options';
import { runCli } from '../../src-renderer/engine/cli/run-cli';
import { recordToDelimited } from '../../src-renderer/engine/synthetic/delimited-writer';
import { generateSyntheticTest } from '../../src-renderer/engine/synthetic/generate';
import type { SyntheticTruth } from '../../src-renderer/engine/synthetic/spec';

// The command line's contract is shared/contracts/cli.md (in the repository's shared
// documents): field names, MPa values at depth, exit codes 0/1/2, JSON only on stdout.
// Fixture files are synthetic contractor-style CSVs whose truth the generator sets.
const run = promisify(execFile);
const PICK_KEYS = ['leakOff', 'breakdown', 'propagation', 'isip', 'closure', 'reopening', 'fitMaximum', 'extension'];
const CRITERIA = ['loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'second-cycle', 'sampling', 'gauge-range'];

let dir = '';
const truths: Record<string, SyntheticTruth> = {};

function capture() {
  let out = '';
  let err = '';
  return {
    io: { stdout: { write: (s: string) => { out += s; } }, stderr: { write: (s: string) => { err += s; } } },
    get out() { return out; },
    get err() { return err; },
  };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'stress-ledger-cli-'));
  for (const type of ['fit', 'lot', 'xlot', 'srt', 'dfit'] as const) {
    const { record, truth } = generateSyntheticTest({ type, depthTvd: 2000, shmin: 34e6, seed: 5, metadata: { well: 'Harrow Flats HF-7' } });
    truths[type] = truth;
    writeFileSync(join(dir, `${type}.csv`), recordToDelimited(record, 'comma-psi-bbl'));
  }
  const lot = recordToDelimited(generateSyntheticTest({ type: 'lot', depthTvd: 1500, shmin: 25.75e6 }).record, 'comma-psi-bbl').split('\n');
  const row = lot.findIndex((l) => /^\d/.test(l)) + 10;
  lot[row] = lot[row].replace(/,[^,]*,/, ',12x.5,');
  writeFileSync(join(dir, 'broken.csv'), lot.join('\n'));
  // A surface-gauge file with no TVD and no mud density in its header.
  const bare = generateSyntheticTest({ type: 'lot', depthTvd: 1500, shmin: 25.75e6 }).record;
  const meta = { ...bare.metadata };
  delete meta.depthTvd;
  delete meta.depthMd;
  delete meta.mudDensity;
  writeFileSync(join(dir, 'no-depth.csv'), recordToDelimited({ ...bare, metadata: meta }, 'comma-psi-bbl'));
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('analyze command', () => {
  it('should print only the contract JSON on stdout, with MPa picks at depth, and exit 0', async () => {
    const c = capture();
    const code = await runCli(['analyze', join(dir, 'xlot.csv'), join(dir, 'lot.csv'), '--json'], c.io);
    expect(code).toBe(0);
    const doc = JSON.parse(c.out);
    expect(doc.tool.name).toBeTypeOf('string');
    expect(doc.tool.version).toBeTypeOf('string');
    expect(doc.caution).toMatch(/qualified engineer/);
    expect(doc.caution).toMatch(/well-control policy/);
    expect(doc.results).toHaveLength(2);
    const x = doc.results[0];
    expect(x).toMatchObject({ file: 'xlot.csv', error: null, type: 'xlot', typeInferred: false });
    expect(x.samples).toBeGreaterThan(1000);
    expect(x.depthTvd.unit).toBe('m');
    expect(x.depthTvd.value).toBeCloseTo(2000, 1);
    expect(x.cycles).toHaveLength(2);
    for (const cycle of x.cycles) {
      expect(Object.keys(cycle.picks).every((k) => PICK_KEYS.includes(k))).toBe(true);
      expect(cycle.loadingSlope.unit).toBe('MPa/m3');
      expect(cycle.expectedSlope.unit).toBe('MPa/m3');
      expect(cycle.loadingR2).toBeGreaterThan(0.99);
      for (const pick of Object.values(cycle.picks) as { unit: string; time: { unit: string }; method: string }[]) {
        expect(pick.unit).toBe('MPa');
        expect(pick.time.unit).toBe('s');
        expect(pick.method).toBeTypeOf('string');
      }
    }
    // Truth (downhole, set by the generator): breakdown 38.8 MPa, reopening 34.8 MPa.
    const t = truths.xlot.cycles;
    expect(Math.abs(x.cycles[0].picks.breakdown.value - t[0].picks.breakdown!.pressure / 1e6)).toBeLessThan(0.05);
    expect(Math.abs(x.cycles[1].picks.reopening.value - t[1].picks.reopening!.pressure / 1e6)).toBeLessThan(0.1);
    expect(x.cycles[0].picks.reopening).toBeUndefined();
    // Stiffness 1/(c V) in MPa/m3 (synthetic truth).
    expect(x.cycles[0].loadingSlope.value / (truths.xlot.loadingSlope / 1e6)).toBeCloseTo(1, 2);
    expect(x.stress.shmin).toMatchObject({ unit: 'MPa' });
    expect(['estimate', 'lower-bound', 'upper-bound']).toContain(x.stress.shmin.kind);
    expect(x.stress.shmax).toMatchObject({ unit: 'MPa' });
    expect(x.stress.shmax.cautions.length).toBeGreaterThan(0);
    expect(x.stress.shmax.low).toBeTypeOf('number');
    expect(x.stress.sv.unit).toBe('MPa');
    expect(x.stress.pp.unit).toBe('MPa');
    expect(['A', 'B', 'C', 'D', 'E']).toContain(x.quality.grade);
    const ids = x.quality.criteria.map((k: { id: string }) => k.id);
    for (const id of CRITERIA) expect(ids).toContain(id);
    for (const k of x.quality.criteria) expect([true, false, null]).toContain(k.pass);
    expect(doc.results[1].picks).toBeUndefined();
    expect(doc.results[1].cycles[0].picks.reopening).toBeUndefined();
    expect(c.err).toMatch(/xlot\.csv/);
  });

  it('should keep every pick to its test type', async () => {
    const c = capture();
    await runCli(['analyze', ...['fit', 'srt', 'dfit'].map((t) => join(dir, `${t}.csv`)), '--json'], c.io);
    const [fit, srt, dfit] = JSON.parse(c.out).results;
    expect(Object.keys(fit.cycles[0].picks)).toEqual(['fitMaximum']);
    expect(fit.stress.shmin.kind).toBe('lower-bound');
    expect(srt.cycles[0].picks.extension.rate.unit).toBe('m3/min');
    const set = truths.srt.cycles[0].picks.extension!;
    expect(Math.abs(srt.cycles[0].picks.extension.value - set.pressure / 1e6)).toBeLessThan(0.2);
    expect(srt.cycles[0].picks.extension.rate.value).toBeCloseTo((set.rate! * 60), 2);
    expect(dfit.cycles[0].picks.isip.unit).toBe('MPa');
  });

  it('should list a broken file with its error code and line, and exit 1', async () => {
    const c = capture();
    const code = await runCli(['analyze', join(dir, 'broken.csv'), join(dir, 'lot.csv'), join(dir, 'missing.csv'), '--json'], c.io);
    expect(code).toBe(1);
    const doc = JSON.parse(c.out);
    expect(doc.results.map((r: { file: string }) => r.file)).toEqual(['broken.csv', 'lot.csv', 'missing.csv']);
    expect(doc.results[0].error.code).toBe('non-numeric-cell');
    expect(doc.results[0].error.line).toBeGreaterThan(10);
    expect(doc.results[0].error.message).toMatch(/12x\.5/);
    expect(doc.results[1].error).toBeNull();
    expect(doc.results[2].error.code).toBe('file-not-found');
  });

  it('should refuse a surface gauge with no depth or mud, and accept them as options that win', async () => {
    const c = capture();
    expect(await runCli(['analyze', join(dir, 'no-depth.csv'), '--json'], c.io)).toBe(1);
    const error = JSON.parse(c.out).results[0].error;
    expect(error.code).toBe('bad-metadata');
    expect(error.message).toMatch(/TVD/);
    expect(error.message).toMatch(/mud density/);
    const d = capture();
    expect(await runCli(['analyze', join(dir, 'no-depth.csv'), '--tvd', '4921.26ft', '--mud=1.2sg', '--pp', '10kPa/m', '--sv', '1psi/ft', '--json'], d.io)).toBe(0);
    const r = JSON.parse(d.out).results[0];
    // 4921.26 ft x 0.3048 m/ft (exact, NIST SP 811) = 1500.0 m.
    expect(r.depthTvd.value).toBeCloseTo(1500, 1);
    // 10 kPa/m x 1500 m = 15 MPa; 1 psi/ft = 22.6206 kPa/m (NIST SP 811 factors) x 1500 m = 33.93 MPa.
    expect(r.stress.pp.value).toBeCloseTo(15, 3);
    expect(r.stress.sv.value).toBeCloseTo(33.931, 2);
    // 1.2 sg column over 1500 m: 1200 x 9.80665 x 1500 = 17.652 MPa added (hydrostatic law).
    expect(r.hydrostaticCorrection.value).toBeCloseTo(17.652, 3);
  });

  it('should exit 2 on bad arguments, with a JSON error document under --json', async () => {
    for (const argv of [
      ['analyze', join(dir, 'lot.csv'), '--tvd', '12parsec', '--json'],
      ['analyze', join(dir, 'lot.csv'), '--depth', '12m', '--json'],
      ['analyze', '--json'],
      ['analyse', join(dir, 'lot.csv'), '--json'],
      ['analyze', join(dir, 'lot.csv'), '--type', 'minifrac', '--json'],
      ['analyze', join(dir, 'lot.csv'), '--tvd'],
    ]) {
      const c = capture();
      expect(await runCli(argv, c.io)).toBe(2);
      expect(c.err).toMatch(/error/);
      if (argv.includes('--json')) expect(JSON.parse(c.out).error.code).toMatch(/bad-argument|unknown-unit/);
      else expect(c.out).toBe('');
    }
  });

  it('should print usage for --help and a readable summary without --json', async () => {
    const h = capture();
    expect(await runCli(['--help'], h.io)).toBe(0);
    expect(h.out).toMatch(/--system-volume/);
    const t = capture();
    expect(await runCli(['analyze', join(dir, 'xlot.csv')], t.io)).toBe(0);
    expect(t.out).toMatch(/XLOT/);
    expect(t.out).toMatch(/breakdown\s+38\.\d\d MPa/);
    expect(t.out).toMatch(/grade [A-E]/);
    expect(t.out).toMatch(/qualified engineer/);
  });

  it('should hand the model command to its module', async () => {
    const c = capture();
    expect(await runCli(['model', '--help'], c.io)).toBe(0);
    expect(c.out).toMatch(/model/i);
  });

  it('should run as a process through npm with JSON alone on stdout', async () => {
    const { stdout, stderr } = await run('npm', ['run', '--silent', 'cli', '--', 'analyze', join(dir, 'lot.csv'), '--json'], { cwd: process.cwd() });
    const doc = JSON.parse(stdout);
    expect(doc.results[0].type).toBe('lot');
    expect(stderr).toMatch(/lot\.csv/);
    const failed = await run('npx', ['tsx', 'src-renderer/engine/cli/main.ts', 'analyze', join(dir, 'broken.csv'), '--json']).catch((e) => e);
    expect(failed.code).toBe(1);
    expect(JSON.parse(failed.stdout).results[0].error.code).toBe('non-numeric-cell');
    const bad = await run('npx', ['tsx', 'src-renderer/engine/cli/main.ts', 'analyze', '--bogus']).catch((e) => e);
    expect(bad.code).toBe(2);
  });
});

describe('parseCliArguments', () => {
  it('should read values with units into SI and tell pressures from gradients', () => {
    const a = parseCliArguments(['analyze', 'a.csv', 'b.csv', '--tvd', '1520m', '--mud', '10.4ppg', '--pp', '21.3MPa', '--sv=0.45psi/ft', '--system-volume', '390bbl', '--compressibility', '3.4e-6/psi', '--gauge', 'downhole', '--type', 'XLOT']);
    expect(a.command).toBe('analyze');
    expect(a.files).toEqual(['a.csv', 'b.csv']);
    expect(a.tvd).toBe(1520);
    // 10.4 ppg x 119.826427 kg/m3 per ppg (lb/US gal, NIST SP 811) = 1246.19 kg/m3.
    expect(a.mud).toBeCloseTo(1246.195, 2);
    expect(a.pp).toEqual({ kind: 'pressure', value: 21.3e6 });
    // 0.45 psi/ft = 0.45 x 6894.757 Pa / 0.3048 m = 10 179.0 Pa/m.
    expect(a.sv?.kind).toBe('gradient');
    expect(a.sv?.value).toBeCloseTo(10179.0, 0);
    // 390 bbl x 0.158987294928 m3 (exact) = 62.005 m3.
    expect(a.systemVolume).toBeCloseTo(62.005, 3);
    // 3.4e-6 /psi / 6894.757 Pa/psi = 4.931e-10 /Pa.
    expect(a.compressibility).toBeCloseTo(4.9313e-10, 13);
    expect(a.gauge).toBe('downhole');
    expect(a.type).toBe('xlot');
  });

  it('should keep command-specific options apart', () => {
    const a = parseCliArguments(['model', 'a.csv', '--min-grade', 'C', '--json'], ['min-grade']);
    expect(a.extra['min-grade']).toBe('C');
    expect(a.json).toBe(true);
    expect(() => parseCliArguments(['model', 'a.csv', '--min-grade', 'C'])).toThrow(/unknown option/);
  });
});
