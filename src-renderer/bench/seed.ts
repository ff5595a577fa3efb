/**
 * Archive seeding for the in-browser speed measurements (bench/app.bench.ts), served as a
 * page of its own in the web build (bench/index.html, linked from nowhere in the app).
 * It writes rows straight into the app's Dexie database (the real schema of db.ts) with
 * bulkPut, in chunks the bench asks for, so a large archive is written once per bench run:
 * the seeding is not what is measured. Synthetic records of the invented Harrow Flats
 * field, tests by Cobalt Ridge Test Services.
 */
import { StressLedgerDb, nameKey, type StoredSamples, type StoredTest } from '../archive/db';
import { GRADES } from '../engine/result';
import { TEST_TYPES, type TestType } from '../engine/record';
import { kgPerCubicMetre, metre } from '../engine/units/quantity';

const STATES = ['imported', 'in-review', 'accepted', 'rejected'] as const;
const CONTRACTOR = 'Cobalt Ridge Test Services';
const IMPORTER = 'Maren Holt';
const REVIEWER = 'Idris Calloway';
/** Id of the one long record (1,000,000 samples by default). */
export const LARGE_TEST_ID = 'bench-large-record';
export const LARGE_TEST_WELL = 'HF-900 long record';

/** Pressure (Pa) and rate (m3/s) of a synthetic leak-off test at time t (s) of a record lasting `duration` s. */
function leakOffAt(t: number, duration: number, scale: number): { pressure: number; rate: number } {
  const pumpStart = duration * 0.05;
  const pumpEnd = duration * 0.35;
  const rate = 0.5 * 0.158987294928 / 60; // 0.5 bbl/min in m3/s (NIST SP 811 barrel)
  const peak = 12e6 * scale;
  if (t < pumpStart) return { pressure: 1e5, rate: 0 };
  if (t < pumpEnd) {
    const u = (t - pumpStart) / (pumpEnd - pumpStart);
    // Straight loading to 70 % of the way, then bending over to the peak.
    const p = u < 0.7 ? u / 0.7 * 0.85 * peak : 0.85 * peak + 0.15 * peak * (1 - ((1 - u) / 0.3) ** 2);
    return { pressure: 1e5 + p, rate };
  }
  const dt = t - pumpEnd;
  return { pressure: 1e5 + 0.55 * peak + 0.4 * peak * Math.exp(-dt / (duration * 0.08)), rate: 0 };
}

/** The four sample arrays of one synthetic record (interval 1 s, small deterministic noise). */
function samplesOf(testId: string, count: number, scale: number): StoredSamples {
  const time = new Float64Array(count);
  const pressure = new Float64Array(count);
  const rate = new Float64Array(count);
  const volume = new Float64Array(count);
  const interval = count > 100_000 ? 0.1 : 1;
  const duration = (count - 1) * interval;
  let v = 0;
  let noise = 12345;
  for (let k = 0; k < count; k++) {
    const t = k * interval;
    const s = leakOffAt(t, duration, scale);
    noise = (noise * 1103515245 + 12345) & 0x7fffffff;
    time[k] = t;
    pressure[k] = s.pressure + ((noise / 0x7fffffff) - 0.5) * 2e3;
    rate[k] = s.rate;
    if (k > 0) v += s.rate * interval;
    volume[k] = v;
  }
  return { testId, time, pressure, rate, volume };
}

/** The stored row of synthetic test number `i`. */
function testRow(i: number, id = `bench-${String(i).padStart(6, '0')}`, wellName = `HF-${1 + (i % 400)}`): StoredTest {
  const state = STATES[Math.floor(i / 3) % STATES.length];
  const depthTvd = i % 17 === 0 ? null : 500 + ((i * 37) % 3500);
  const type = TEST_TYPES[i % TEST_TYPES.length];
  return {
    id, fieldId: i % 5 === 0 ? 'field-bench-2' : 'field-bench-1', fieldName: i % 5 === 0 ? 'Harrow Flats North' : 'Harrow Flats',
    wellId: `well-bench-${wellName}`, wellName, wellNameKey: nameKey(wellName), type, typeInferred: i % 3 === 0,
    depthTvd, depthMd: null, shmin: 1e7 + ((i * 7919) % 5e7), shminKind: 'estimate',
    grade: GRADES[Math.floor(i / 7) % GRADES.length], state,
    reviewer: state === 'accepted' || state === 'rejected' ? REVIEWER : null, lastPickAuthor: IMPORTER,
    fileName: `${wellName}_${type.toUpperCase()}_${i}.csv`, fileHash: `bench${i.toString(16).padStart(59, '0')}`,
    importedAt: new Date(Date.UTC(2020, 0, 1) + i * 3.6e6).toISOString(), importedBy: IMPORTER, contractor: CONTRACTOR,
    metadata: {
      well: wellName, field: 'Harrow Flats', contractor: CONTRACTOR, testType: type,
      ...(depthTvd !== null ? { depthTvd: metre(depthTvd) } : {}), mudDensity: kgPerCubicMetre(1200), gaugePosition: 'surface',
    },
    source: {
      fileName: `${wellName}_${type.toUpperCase()}_${i}.csv`, format: 'synthetic', layout: 'bench-synthetic',
      columns: [], derived: { rate: false, volume: true }, warnings: [],
    },
  };
}

/**
 * Writes tests number `start` to `start + count - 1` with `samplesPerTest` samples each, in
 * one transaction. Returns the time taken, ms.
 */
async function seedTests(start: number, count: number, samplesPerTest: number): Promise<number> {
  const t0 = performance.now();
  const db = new StressLedgerDb();
  const tests: StoredTest[] = [];
  const samples: StoredSamples[] = [];
  for (let i = start; i < start + count; i++) {
    const row = testRow(i);
    tests.push(row);
    samples.push(samplesOf(row.id, samplesPerTest, 0.6 + 0.8 * ((i * 7919) % 1000) / 1000));
  }
  await db.transaction('rw', db.tests, db.samples, async () => {
    await db.tests.bulkPut(tests);
    await db.samples.bulkPut(samples);
  });
  db.close();
  return performance.now() - t0;
}

/**
 * Writes the one long record (`samples` samples, 0.1 s apart: pumping, then a long
 * shut-in), as a test of the given type (default DFIT, whose review opens on the shut-in
 * diagnostics).
 */
async function seedLargeTest(samples: number, type: TestType = 'dfit'): Promise<number> {
  const t0 = performance.now();
  const db = new StressLedgerDb();
  const row: StoredTest = { ...testRow(1, LARGE_TEST_ID, LARGE_TEST_WELL), type, typeInferred: false, state: 'imported', reviewer: null };
  row.metadata = { ...row.metadata, testType: type };
  await db.transaction('rw', db.tests, db.samples, async () => {
    await db.tests.put(row);
    await db.samples.put(samplesOf(row.id, samples, 1));
  });
  db.close();
  return performance.now() - t0;
}

/** Adds the user and remembers them on this device (as the start screen does), so loads open the list. */
async function seedUser(name: string): Promise<void> {
  const db = new StressLedgerDb();
  await db.users.put({ name, createdAt: new Date().toISOString() });
  db.close();
  localStorage.setItem('stress-ledger.current-user', name);
}

async function countTests(): Promise<{ tests: number; samples: number }> {
  const db = new StressLedgerDb();
  const out = { tests: await db.tests.count(), samples: await db.samples.count() };
  db.close();
  return out;
}

const api = { seedTests, seedLargeTest, seedUser, countTests, largeTestId: LARGE_TEST_ID, largeTestWell: LARGE_TEST_WELL };
(window as unknown as { benchSeed: typeof api }).benchSeed = api;
document.body.dataset.ready = 'true';
