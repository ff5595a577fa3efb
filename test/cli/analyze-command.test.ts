import { execFile } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contractShminKind, contractShminSource, stressJson } from '../../src-renderer/engine/cli/json-output';
import { parseCliArguments } from '../../src-renderer/engine/cli/options';
import { runCli } from '../../src-renderer/engine/cli/run-cli';
import { recordToDelimited } from '../../src-renderer/engine/synthetic/delimited-writer';
import { generateSyntheticTest } from '../../src-renderer/engine/synthetic/generate';
import type { SyntheticTruth } from '../../src-renderer/engine/synthetic/spec';
import type { StressEstimates } from '../../src-renderer/engine/result';

// The command line's contract is shared/contracts/cli.md (in the repository's shared
// documents): field names, MPa values at depth, exit codes 0/1/2, JSON only on stdout.
// Fixture files are synthetic contractor-style CSVs whose truth the generator sets.
const run = promisify(execFile);
const PICK_KEYS = ['leakOff', 'breakdown', 'propagation', 'isip', 'closure', 'reopening', 'fitMaximum', 'extension'];
const CRITERIA = ['loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'second-cycle', 'sampling', 'gauge-range'];
/** Ids added beside the contract's ("More may be added"); the contract's are never renamed. */
const ADDED_CRITERIA = ['cycle-repeat'];

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
    expect(['estimate', 'lower-bound']).toContain(x.stress.shmin.kind);
    expect(x.stress.shmax).toMatchObject({ unit: 'MPa' });
    expect(x.stress.shmax.cautions.length).toBeGreaterThan(0);
    expect(x.stress.shmax.low).toBeTypeOf('number');
    expect(x.stress.sv.unit).toBe('MPa');
    expect(x.stress.pp.unit).toBe('MPa');
    expect(['A', 'B', 'C', 'D', 'E']).toContain(x.quality.grade);
    const ids = x.quality.criteria.map((k: { id: string }) => k.id);
    for (const id of CRITERIA) expect(ids).toContain(id);
    for (const k of x.quality.criteria) expect([true, false, null]).toContain(k.pass);
    // A valid later cycle: reopening / breakdown below 1 (the generator sets Pr below Pb), and
    // ISIP and closure repeating (one ISIP and closure set for all cycles), each its own criterion.
    const second = x.quality.criteria.find((k: { id: string }) => k.id === 'second-cycle');
    expect(second).toMatchObject({ pass: true, limit: 1, unit: 'ratio' });
    expect(second.value).toBeCloseTo(t[1].picks.reopening!.pressure / t[0].picks.breakdown!.pressure, 2);
    expect(x.quality.criteria.find((k: { id: string }) => k.id === 'cycle-repeat')).toMatchObject({ pass: true, limit: 0.05, unit: 'fraction' });
    expect(doc.results[1].quality.criteria.map((k: { id: string }) => k.id)).not.toContain('cycle-repeat');
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

// Every rule of contracts/cli.md "analyze --json output", checked literally over every demo
// test file (invented Harrow Flats data; demo/manifest.json states how each was built). The
// survey and the density log are side inputs of `model`, not tests.
const DEMO = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'demo');
const DEMO_TESTS = readdirSync(DEMO).filter((f) => /\.(csv|txt|las|xlsx)$/.test(f) && f !== 'HF-3_survey.csv' && f !== 'HF-6_density.las').sort();
const SHMIN_KINDS = ['estimate', 'lower-bound'];
const SHMIN_FROM = ['closure', 'isip', 'leakOff', 'fitMaximum', 'extension'];
// Criteria by test type (contract: "each present when it applies to the test type"). A
// step-rate test loads in steps, not along one straight line (US EPA Region 8 step-rate
// procedure, METHODS.md), so the two loading criteria do not apply to it; the second-cycle and
// cycle-repeat checks apply to the extended leak-off test only (common practice, METHODS.md).
const CRITERIA_BY_TYPE: Record<string, string[]> = {
  fit: ['loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'sampling', 'gauge-range'],
  lot: ['loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'sampling', 'gauge-range'],
  dfit: ['loading-linearity', 'loading-stiffness', 'rate-stability', 'shut-in-stability', 'sampling', 'gauge-range'],
  xlot: [...CRITERIA, 'cycle-repeat'],
  srt: ['rate-stability', 'shut-in-stability', 'sampling', 'gauge-range'],
};
const ALL_CRITERIA = [...CRITERIA, ...ADDED_CRITERIA];

type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
interface ManifestTest { file: string; type: string; depthTvd: { value: number; unit: string }; samples: number; flaws: string[] }

function isQuantity(q: unknown, unit: string): boolean {
  return typeof q === 'object' && q !== null && typeof (q as Json).value === 'number' && Number.isFinite((q as Json).value) && (q as Json).unit === unit;
}

describe('analyze --json contract', () => {
  let demoDoc: Json = {};
  let demoCode = -1;
  let demoErr = '';
  const manifest = new Map<string, ManifestTest>();

  beforeAll(async () => {
    const c = capture();
    demoCode = await runCli(['analyze', ...DEMO_TESTS.map((f) => join(DEMO, f)), '--json'], c.io);
    demoDoc = JSON.parse(c.out);
    demoErr = c.err;
    for (const t of JSON.parse(readFileSync(join(DEMO, 'manifest.json'), 'utf8')).tests as ManifestTest[]) manifest.set(t.file, t);
  }, 120_000);

  const results = (): Json[] => demoDoc.results as Json[];
  const cycles = (): { r: Json; c: Json }[] => results().flatMap((r) => (r.cycles as Json[]).map((c) => ({ r, c })));
  const picks = (): { r: Json; c: Json; key: string; pick: Json }[] =>
    cycles().flatMap(({ r, c }) => Object.entries(c.picks as Json).map(([key, pick]) => ({ r, c, key, pick: pick as Json })));

  it('should exit 0 with a top-level {tool: {name, version}, results: [...]} listing every demo test in order', () => {
    expect(DEMO_TESTS.length).toBe(18);
    expect(demoCode).toBe(0);
    expect(demoDoc.tool).toEqual({ name: expect.any(String), version: expect.any(String) });
    expect(demoDoc.tool.version).toMatch(/^\d+\.\d+\.\d+/);
    expect(results().map((r) => r.file)).toEqual(DEMO_TESTS);
    // Progress goes to stderr, never into the JSON.
    expect(demoErr).toMatch(/\[18\/18\]/);
  });

  it('should give each result file, error null, type, typeInferred, samples and depthTvd in m, as the manifest built them', () => {
    for (const r of results()) {
      const set = manifest.get(r.file);
      expect(set, r.file).toBeDefined();
      expect(r.error).toBeNull();
      expect(r.type).toBe(set!.type);
      expect(r.typeInferred).toBe(false);
      expect(Number.isInteger(r.samples)).toBe(true);
      expect(r.samples).toBe(set!.samples);
      expect(isQuantity(r.depthTvd, 'm')).toBe(true);
      expect(r.depthTvd.value).toBeCloseTo(set!.depthTvd.unit === 'm' ? set!.depthTvd.value : set!.depthTvd.value * 0.3048, 0);
    }
  });

  it('should number cycles from 1 and give loadingSlope and expectedSlope in MPa/m3 and a loadingR2', () => {
    for (const r of results()) {
      expect((r.cycles as Json[]).map((c) => c.index)).toEqual((r.cycles as Json[]).map((_, i) => i + 1));
      expect(r.cycles.length).toBeGreaterThan(0);
    }
    for (const { c } of cycles()) {
      expect(isQuantity(c.loadingSlope, 'MPa/m3')).toBe(true);
      // Every demo file states its system volume and compressibility, so the expected slope is known.
      expect(isQuantity(c.expectedSlope, 'MPa/m3')).toBe(true);
      expect(c.loadingR2).toBeGreaterThan(0);
      expect(c.loadingR2).toBeLessThanOrEqual(1);
    }
  });

  it('should use only the contract pick keys, each with value MPa, time s and a method, never null', () => {
    expect(picks().length).toBeGreaterThan(50);
    for (const { key, pick } of picks()) {
      expect(PICK_KEYS).toContain(key);
      expect(pick).not.toBeNull();
      expect(isQuantity(pick, 'MPa')).toBe(true);
      expect(isQuantity(pick.time, 's')).toBe(true);
      expect(pick.method).toMatch(/\S/);
    }
  });

  it('should keep reopening to later cycles, fitMaximum to FITs and extension (with rate in m3/min) to SRTs', () => {
    for (const { r, c, key, pick } of picks()) {
      if (key === 'reopening') expect(c.index).toBeGreaterThanOrEqual(2);
      if (key === 'fitMaximum') expect(r.type).toBe('fit');
      if (key === 'extension') {
        expect(r.type).toBe('srt');
        expect(isQuantity(pick.rate, 'm3/min')).toBe(true);
      }
    }
    for (const r of results()) {
      if (r.type === 'fit') for (const c of r.cycles as Json[]) expect(Object.keys(c.picks)).toEqual(['fitMaximum']);
      if (r.type === 'srt') expect(r.cycles[0].picks.extension).toBeDefined();
      // Absent, not null: a single-cycle test has no reopening key at all.
      expect('reopening' in r.cycles[0].picks).toBe(false);
    }
  });

  it('should give shmin a kind and a from within the contract vocabulary', () => {
    for (const r of results()) {
      const shmin = r.stress.shmin as Json;
      expect(isQuantity(shmin, 'MPa')).toBe(true);
      expect(SHMIN_KINDS).toContain(shmin.kind);
      expect(SHMIN_FROM).toContain(shmin.from);
      expect(PICK_KEYS).toContain(shmin.fromPick);
      // A FIT is stopped before any leak-off: a lower bound only (White et al. 2002, METHODS.md).
      if (r.type === 'fit') expect(shmin).toMatchObject({ kind: 'lower-bound', from: 'fitMaximum', bound: 'lower' });
    }
  });

  it('should give shmax value, unit, low, high, method and cautions, and sv and pp in MPa', () => {
    for (const r of results()) {
      const sh = r.stress.shmax as Json;
      expect(sh.unit).toBe('MPa');
      // No point value without a valid later-cycle reopening: value is null and a caution says why.
      if (sh.value === null) expect(sh.cautions.join(' ')).toMatch(/reopening/i);
      else expect(sh.value).toBeTypeOf('number');
      expect(sh.low).toBeTypeOf('number');
      expect(sh.high).toBeGreaterThanOrEqual(sh.low);
      expect(sh.method).toMatch(/\S/);
      expect(sh.cautions.length).toBeGreaterThan(0);
      for (const caution of sh.cautions) expect(caution).toBeTypeOf('string');
      expect(isQuantity(r.stress.sv, 'MPa')).toBe(true);
      expect(isQuantity(r.stress.pp, 'MPa')).toBe(true);
    }
    // demo/manifest.json: every XLOT has a later-cycle reopening below breakdown, so SHmax has a
    // value, except the one built with the flaw 'reopening-above-breakdown'.
    for (const r of results().filter((x) => x.type === 'xlot')) {
      const flawed = manifest.get(r.file)!.flaws.includes('reopening-above-breakdown');
      if (flawed) expect(r.stress.shmax.value).toBeNull();
      else expect(r.stress.shmax.value).toBeTypeOf('number');
    }
  });

  it('should grade A to E with criteria {id, pass, value, limit, message}, each contract id present when it applies', () => {
    for (const r of results()) {
      expect(['A', 'B', 'C', 'D', 'E']).toContain(r.quality.grade);
      const criteria = r.quality.criteria as Json[];
      const ids = criteria.map((k) => k.id);
      for (const id of CRITERIA_BY_TYPE[r.type]) expect(ids, `${r.file} ${id}`).toContain(id);
      for (const id of ALL_CRITERIA.filter((x) => !CRITERIA_BY_TYPE[r.type].includes(x))) expect(ids).not.toContain(id);
      for (const k of criteria) {
        expect(Object.keys(k)).toEqual(expect.arrayContaining(['id', 'pass', 'value', 'limit', 'message', 'unit']));
        expect([true, false, null]).toContain(k.pass);
        expect(k.value === null || typeof k.value === 'number').toBe(true);
        expect(k.limit === null || typeof k.limit === 'number').toBe(true);
        expect(k.message).toMatch(/\S/);
      }
    }
  });

  it('should list a criterion that cannot be judged with pass null and a message saying what is missing', async () => {
    const { record } = generateSyntheticTest({ type: 'lot', depthTvd: 1500, shmin: 25.75e6, seed: 3, includeSystemMetadata: false });
    const path = join(dir, 'no-volume.csv');
    writeFileSync(path, recordToDelimited(record, 'comma-psi-bbl'));
    const c = capture();
    expect(await runCli(['analyze', path, '--json'], c.io)).toBe(0);
    const r = JSON.parse(c.out).results[0];
    const stiffness = r.quality.criteria.find((k: Json) => k.id === 'loading-stiffness');
    expect(stiffness.pass).toBeNull();
    expect(stiffness.message).toMatch(/system volume/);
    // "expectedSlope ... if known": not known here.
    expect(r.cycles[0].expectedSlope).toBeNull();
    // Given on the command line, the same criterion is judged (options win over the file).
    const d = capture();
    expect(await runCli(['analyze', path, '--system-volume', '60m3', '--compressibility', '6e-10/Pa', '--json'], d.io)).toBe(0);
    const judged = JSON.parse(d.out).results[0];
    expect(judged.quality.criteria.find((k: Json) => k.id === 'loading-stiffness').pass).toBe(true);
    // 1 / (6e-10 /Pa x 60 m3) = 27.78 MPa/m3 (the stiffness law of METHODS.md).
    expect(judged.cycles[0].expectedSlope.value).toBeCloseTo(27.778, 2);
  });

  it('should say when the type was inferred', async () => {
    const { record } = generateSyntheticTest({ type: 'xlot', depthTvd: 2000, shmin: 34e6, seed: 5 });
    const meta = { ...record.metadata };
    delete meta.testType;
    const path = join(dir, 'untyped.csv');
    writeFileSync(path, recordToDelimited({ ...record, metadata: meta }, 'comma-psi-bbl'));
    const c = capture();
    expect(await runCli(['analyze', path, '--json'], c.io)).toBe(0);
    expect(JSON.parse(c.out).results[0]).toMatchObject({ type: 'xlot', typeInferred: true });
  });

  it('should map an ISIP-derived upper bound and a propagation source into the contract words, keeping both in added fields', () => {
    // ISIP: "a close upper bound on Shmin"; FPP: "an upper bound" (METHODS.md, White et al. 2002).
    expect(contractShminKind('upper-bound')).toEqual({ kind: 'estimate', bound: 'upper' });
    expect(contractShminKind('lower-bound')).toEqual({ kind: 'lower-bound', bound: 'lower' });
    expect(contractShminKind('estimate')).toEqual({ kind: 'estimate', bound: null });
    // Fracture propagation pressure is the trade's fracture extension pressure (common practice).
    expect(contractShminSource('propagation')).toEqual({ from: 'extension', fromPick: 'propagation' });
    expect(contractShminSource('isip')).toEqual({ from: 'isip', fromPick: 'isip' });
    expect(() => contractShminSource('breakdown')).toThrow(/breakdown/);
    const stress: StressEstimates = {
      shmin: { value: 34.5e6, kind: 'upper-bound', from: 'isip', cycle: 1 },
      shmax: null,
      sv: { value: 45e6, source: 'given' },
      pp: { value: 20e6, source: 'given' },
      frictionCoefficient: 0.6,
      tensileStrength: null,
    };
    expect(stressJson(stress).shmin).toEqual({ value: 34.5, unit: 'MPa', kind: 'estimate', bound: 'upper', from: 'isip', fromPick: 'isip', cycle: 1 });
    const fromPropagation = stressJson({ ...stress, shmin: { value: 35.2e6, kind: 'upper-bound', from: 'propagation', cycle: 2 } }).shmin;
    expect(fromPropagation).toMatchObject({ kind: 'estimate', bound: 'upper', from: 'extension', fromPick: 'propagation' });
  });

  it('should carry a pick that the gauge clipped as a lower bound', async () => {
    const { record } = generateSyntheticTest({ type: 'xlot', depthTvd: 2000, shmin: 34e6, seed: 5, cycles: 2, flaws: { clippedGauge: true } });
    const path = join(dir, 'clipped.csv');
    writeFileSync(path, recordToDelimited(record, 'comma-psi-bbl'));
    const c = capture();
    expect(await runCli(['analyze', path, '--json'], c.io)).toBe(0);
    const r = JSON.parse(c.out).results[0];
    const bounded = r.cycles.flatMap((cy: Json) => Object.values(cy.picks) as Json[]).filter((p: Json) => p.bound === 'lower');
    expect(bounded.length).toBeGreaterThan(0);
    expect(r.quality.criteria.find((k: Json) => k.id === 'gauge-range').pass).toBe(false);
  });

  it('should exit 2 for every bad option value', async () => {
    const lot = join(dir, 'lot.csv');
    for (const bad of [['--tvd', '-5m'], ['--tvd', '1e400m'], ['--mud', '0sg'], ['--gauge', 'sideways'], ['--pp', '5parsec'], ['--pp', '5m'],
      ['--system-volume', '0'], ['--system-volume', '5MPa'], ['--compressibility', 'x'], ['--type', ''], ['--min-grade', 'B']]) {
      const c = capture();
      expect(await runCli(['analyze', lot, ...bad, '--json'], c.io), bad.join(' ')).toBe(2);
      const doc = JSON.parse(c.out);
      expect(doc.results).toBeUndefined();
      expect(doc.error.code).toMatch(/^(bad-argument|unknown-unit)$/);
    }
  });

  it('should exit 1 when a file is unreadable, still listing every file with a located error', async () => {
    const broken = readdirSync(join(DEMO, 'broken')).filter((f) => f.endsWith('.csv')).sort();
    const c = capture();
    const code = await runCli(['analyze', ...broken.map((f) => join(DEMO, 'broken', f)), join(DEMO, 'HF-1_LOT_0620m.csv'), join(dir, 'nowhere.csv'), '--json'], c.io);
    expect(code).toBe(1);
    const doc = JSON.parse(c.out);
    expect(doc.results.map((r: Json) => r.file)).toEqual([...broken, 'HF-1_LOT_0620m.csv', 'nowhere.csv']);
    for (const r of doc.results.slice(0, broken.length)) {
      expect(r.error).toMatchObject({ code: expect.any(String), message: expect.any(String), line: expect.any(Number) });
      expect(r.cycles).toBeUndefined();
    }
    expect(doc.results[broken.length].error).toBeNull();
    expect(doc.results[broken.length + 1].error.code).toBe('file-not-found');
  });
});
