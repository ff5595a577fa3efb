/**
 * Writes the demo folder: invented pressure tests of the Harrow Flats field (wells HF-1 to
 * HF-6, tests by Cobalt Ridge Test Services) in several contractor layouts, a density log,
 * a directional survey, a few deliberately broken files, a manifest of the set truth and a
 * README. Deterministic: every record comes from the seeded synthetic generator.
 *
 *   npx tsx scripts/make-demo.ts
 *
 * All data are invented. Results from them are for review by a qualified engineer, are not
 * a substitute for the operator's well-control policy, and defer to local regulations and
 * licensed practice.
 */
import { mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ExcelJS from 'exceljs';
import type { TestRecord, TestType } from '../src-renderer/engine/record';
import { recordToDelimited, type DelimitedLayout } from '../src-renderer/engine/synthetic/delimited-writer';
import { generateSyntheticTest } from '../src-renderer/engine/synthetic/generate';
import { densityLogToLas, recordToLas } from '../src-renderer/engine/synthetic/las-writer';
import { seededRandom } from '../src-renderer/engine/synthetic/random';
import type { SyntheticFlaws, SyntheticTruth } from '../src-renderer/engine/synthetic/spec';
import { STANDARD_GRAVITY } from '../src-renderer/engine/units/quantity';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', 'demo');
const CONTRACTOR = 'Cobalt Ridge Test Services';
const FIELD = 'Harrow Flats';
const NOTE = 'Invented demonstration data - Harrow Flats field - not a real well';
const SAFETY = 'Results are for review by a qualified engineer; they are not a substitute for the operator\'s well-control policy and defer to local regulations and licensed practice.';

/** The invented stress field (all at TVD z in m, Pa): Shmin 1.0 MPa + 16.5 kPa/m, Pp 10.0 kPa/m, Sv 1 psi/ft. */
const FIELD_MODEL = {
  shminIntercept: 1.0e6,
  shminGradient: 16.5e3,
  ppGradient: 10.0e3,
  svGradient: 6894.757293168361 / 0.3048,
};
const shminAt = (z: number) => FIELD_MODEL.shminIntercept + FIELD_MODEL.shminGradient * z;
const mudDensityAt = (z: number) => Math.round(1050 + 0.1 * z);

/**
 * The invented formations of Harrow Flats by TVD (m), the same in every well: a shale
 * above 1500 m, a sandstone to 2700 m, a limestone below. Written in each test's metadata.
 */
const FORMATIONS: readonly { name: string; base: number }[] = [
  { name: 'Ashgrove Shale', base: 1500 },
  { name: 'Millrace Sandstone', base: 2700 },
  { name: 'Corbel Limestone', base: Infinity },
];
const formationAt = (z: number) => FORMATIONS.find((f) => z < f.base)!.name;

/** LAS text with the formation as a ~P item (FORM) at the head of the parameter section. */
function withLasFormation(las: string, formation: string): string {
  const marker = '~PARAMETER INFORMATION\n';
  if (!las.includes(marker)) throw new Error('LAS text has no ~P section');
  return las.replace(marker, `${marker} ${'FORM.'.padEnd(16)} ${formation.padEnd(30)} : FORMATION\n`);
}

type Format = DelimitedLayout | 'xlsx-kpa' | 'xlsx-psi' | 'las';

interface DemoTest {
  well: string;
  type: TestType;
  tvd: number;
  format: Format;
  date: string;
  cycles?: number;
  flaws?: SyntheticFlaws;
  sampleInterval?: number;
  gauge?: 'surface' | 'downhole';
  gaugeResolution?: number;
}

const TESTS: DemoTest[] = [
  { well: 'HF-1', type: 'lot', tvd: 620, format: 'comma-psi-bbl', date: '2026-02-03' },
  { well: 'HF-1', type: 'xlot', tvd: 1450, format: 'comma-psi-bbl', date: '2026-02-11', cycles: 3 },
  { well: 'HF-1', type: 'xlot', tvd: 2600, format: 'xlsx-kpa', date: '2026-02-24', cycles: 2 },
  { well: 'HF-2', type: 'fit', tvd: 800, format: 'semicolon-kpa-m3', date: '2026-03-02' },
  { well: 'HF-2', type: 'lot', tvd: 1900, format: 'semicolon-kpa-m3', date: '2026-03-10', flaws: { airInLine: true } },
  { well: 'HF-2', type: 'xlot', tvd: 3100, format: 'semicolon-kpa-m3', date: '2026-03-21', cycles: 2, flaws: { badSecondCycle: 'reopening-above-breakdown' } },
  { well: 'HF-3', type: 'lot', tvd: 1200, format: 'tab-bar-litre', date: '2026-04-04', flaws: { leakingShutIn: true } },
  { well: 'HF-3', type: 'xlot', tvd: 2250, format: 'tab-bar-litre', date: '2026-04-13', cycles: 3, flaws: { clippedGauge: true } },
  { well: 'HF-3', type: 'dfit', tvd: 3400, format: 'las', date: '2026-04-27', gauge: 'downhole' },
  { well: 'HF-4', type: 'fit', tvd: 700, format: 'xlsx-psi', date: '2026-05-05' },
  { well: 'HF-4', type: 'srt', tvd: 1650, format: 'comma-psi-bbl', date: '2026-05-14' },
  { well: 'HF-4', type: 'lot', tvd: 2800, format: 'comma-psi-bbl', date: '2026-05-26', sampleInterval: 10 },
  { well: 'HF-5', type: 'lot', tvd: 1000, format: 'tab-bar-litre', date: '2026-06-02', flaws: { unsteadyRate: true } },
  { well: 'HF-5', type: 'xlot', tvd: 2400, format: 'las', date: '2026-06-12', cycles: 4, gauge: 'downhole' },
  { well: 'HF-5', type: 'lot', tvd: 3500, format: 'semicolon-kpa-m3', date: '2026-06-25', gaugeResolution: 6894.757293168361 },
  { well: 'HF-6', type: 'fit', tvd: 900, format: 'comma-psi-bbl', date: '2026-07-01' },
  { well: 'HF-6', type: 'xlot', tvd: 2100, format: 'tab-bar-litre', date: '2026-07-09', cycles: 2, flaws: { badSecondCycle: 'no-stable-shut-in' } },
  { well: 'HF-6', type: 'dfit', tvd: 3000, format: 'comma-psi-bbl', date: '2026-07-22' },
];

/** Which criterion each flaw is meant to fail. */
const FLAW_FINDINGS: Record<string, string[]> = {
  airInLine: ['loading-stiffness', 'loading-linearity (when the toe is fitted)'],
  leakingShutIn: ['shut-in-stability'],
  unsteadyRate: ['rate-stability'],
  clippedGauge: ['gauge-range'],
  'reopening-above-breakdown': ['second-cycle'],
  'no-stable-shut-in': ['second-cycle'],
  sparseSampling: ['sampling'],
};

// HF-3 is deviated: vertical to 800 m, build 2 deg/30 m to 35 deg inclination at azimuth 62 deg, then hold.
const HF3 = { kickOff: 800, buildPerMetre: (2 * Math.PI) / 180 / 30, hold: (35 * Math.PI) / 180, azimuth: 62 };
function hf3Tvd(md: number): number {
  if (md <= HF3.kickOff) return md;
  const radius = 1 / HF3.buildPerMetre;
  const buildLength = HF3.hold / HF3.buildPerMetre;
  const s = Math.min(md - HF3.kickOff, buildLength);
  let tvd = HF3.kickOff + radius * Math.sin(s * HF3.buildPerMetre);
  if (md - HF3.kickOff > buildLength) tvd += (md - HF3.kickOff - buildLength) * Math.cos(HF3.hold);
  return tvd;
}
function hf3Inclination(md: number): number {
  if (md <= HF3.kickOff) return 0;
  return Math.min(HF3.hold, (md - HF3.kickOff) * HF3.buildPerMetre);
}
function hf3MdForTvd(tvd: number): number {
  let lo = tvd;
  let hi = tvd * 2;
  for (let k = 0; k < 80; k++) { const mid = (lo + hi) / 2; if (hf3Tvd(mid) < tvd) lo = mid; else hi = mid; }
  return (lo + hi) / 2;
}

function fileName(t: DemoTest): string {
  const ext = t.format.startsWith('xlsx') ? 'xlsx' : t.format === 'las' ? 'las' : t.format === 'tab-bar-litre' ? 'txt' : 'csv';
  return `${t.well}_${t.type.toUpperCase()}_${String(t.tvd).padStart(4, '0')}m.${ext}`;
}

async function writeWorkbook(path: string, record: TestRecord, units: 'kpa' | 'psi'): Promise<void> {
  const PSI = 6894.757293168361;
  const BBL = 0.158987294928;
  const wb = new ExcelJS.Workbook();
  wb.creator = CONTRACTOR;
  wb.created = new Date('2026-01-01T00:00:00Z');
  wb.modified = new Date('2026-01-01T00:00:00Z');
  const ws = wb.addWorksheet('Test data');
  const m = record.metadata;
  const meta: [string, string | number, string?][] = [
    ['Well', m.well ?? ''], ['Field', m.field ?? ''], ['Contractor', m.contractor ?? ''],
    ['Test type', (m.testType ?? '').toUpperCase()], ['Date', m.date ?? ''],
  ];
  if (units === 'kpa') {
    meta.push(['TVD', m.depthTvd!, 'm'], ['MD', m.depthMd!, 'm'], ['Mud density', m.mudDensity! / 1000, 'sg'],
      ['Gauge position', m.gaugePosition ?? 'surface'], ['Gauge range', m.gaugeRange! / 1e3, 'kPa'],
      ['Hole diameter', m.holeDiameter! * 1000, 'mm'], ['Open hole length', m.openHoleLength!, 'm'],
      ['System volume', m.systemVolume!, 'm3'], ['Compressibility', m.compressibility! * 1e3, '1/kPa']);
  } else {
    meta.push(['TVD', +(m.depthTvd! / 0.3048).toFixed(1), 'ft'], ['MD', +(m.depthMd! / 0.3048).toFixed(1), 'ft'],
      ['Mud weight', +(m.mudDensity! / 119.826427316).toFixed(2), 'ppg'], ['Gauge position', m.gaugePosition ?? 'surface'],
      ['Gauge range', +(m.gaugeRange! / PSI).toFixed(0), 'psi'], ['Hole diameter', +(m.holeDiameter! / 0.0254).toFixed(3), 'in'],
      ['Open hole length', +(m.openHoleLength! / 0.3048).toFixed(1), 'ft'], ['System volume', +(m.systemVolume! / BBL).toFixed(1), 'bbl'],
      ['Compressibility', +(m.compressibility! * PSI).toExponential(4), '1/psi']);
  }
  if (m.extra?.Formation) meta.push(['Formation', m.extra.Formation]);
  meta.push(['Note', NOTE]);
  for (const row of meta) ws.addRow(row);
  ws.addRow([]);
  const header = units === 'kpa'
    ? ['Time (s)', 'Pressure (kPa)', 'Rate (m3/min)', 'Volume (m3)']
    : ['Time (min)', 'Pressure (psi)', 'Rate (bbl/min)', 'Volume (bbl)'];
  ws.addRow(header);
  for (let i = 0; i < record.time.length; i++) {
    ws.addRow(units === 'kpa'
      ? [+record.time[i].toFixed(1), +(record.pressure[i] / 1e3).toFixed(1), +(record.rate[i] * 60).toFixed(4), +record.volume[i].toFixed(4)]
      : [+(record.time[i] / 60).toFixed(5), +(record.pressure[i] / PSI).toFixed(2), +(record.rate[i] * 60 / BBL).toFixed(3), +(record.volume[i] / BBL).toFixed(3)]);
  }
  const notes = wb.addWorksheet('Notes');
  notes.addRow([NOTE]);
  notes.addRow([SAFETY]);
  const buffer = await wb.xlsx.writeBuffer();
  writeFileSync(path, Buffer.from(buffer as ArrayBuffer));
}

function mpa(pa: number): number {
  return +(pa / 1e6).toFixed(3);
}

function truthForManifest(truth: SyntheticTruth, tvd: number) {
  return {
    pressuresAre: 'downhole at the test TVD, MPa; times in s from the record start',
    shmin: mpa(truth.shmin),
    porePressure: mpa(truth.porePressure),
    verticalStress: mpa(FIELD_MODEL.svGradient * tvd),
    ...(truth.shmax !== undefined ? { shmaxFromReopening: mpa(truth.shmax) } : {}),
    ...(truth.tensileStrength !== undefined ? { tensileStrength: mpa(truth.tensileStrength) } : {}),
    mudColumn: mpa(truth.hydrostatic),
    expectedLoadingSlope: { value: +(truth.expectedSlope / 1e6).toFixed(3), unit: 'MPa/m3' },
    builtLoadingSlope: { value: +(truth.loadingSlope / 1e6).toFixed(3), unit: 'MPa/m3' },
    gaugeRange: mpa(truth.gaugeRange),
    cycles: truth.cycles.map((c) => ({
      index: c.index,
      pumpStart: +c.pumpStartTime.toFixed(1),
      pumpEnd: +c.pumpEndTime.toFixed(1),
      shutInEnd: +c.shutInEndTime.toFixed(1),
      picks: Object.fromEntries(Object.entries(c.picks).map(([k, e]) => [k, {
        pressure: mpa(e!.pressure), time: +e!.time.toFixed(1), ...(e!.rate !== undefined ? { rate: { value: +(e!.rate * 60).toFixed(4), unit: 'm3/min' } } : {}),
      }])),
    })),
  };
}

function writeDensityLog(): { file: string; svAt: Record<string, number> } {
  const random = seededRandom(606);
  const depth: number[] = [];
  const density: number[] = [];
  for (let z = 0; z <= 3600; z += 5) {
    depth.push(z);
    density.push(z < 150 ? Number.NaN : 2450 - 500 * Math.exp(-z / 900) + 12 * random.normal());
  }
  const file = 'HF-6_density.las';
  writeFileSync(join(ROOT, file), densityLogToLas({ depth, density, well: 'HF-6', company: CONTRACTOR, field: FIELD, date: '2026-06-28' }));
  // Sv by the trapezoid rule of rho g dz, with 2000 kg/m3 assumed above the first reading (for the manifest).
  const svAt: Record<string, number> = {};
  let sv = 0;
  for (let i = 1; i < depth.length; i++) {
    const a = Number.isFinite(density[i - 1]) ? density[i - 1] : 2000;
    const b = Number.isFinite(density[i]) ? density[i] : 2000;
    sv += ((a + b) / 2) * STANDARD_GRAVITY * (depth[i] - depth[i - 1]);
    if (depth[i] === 900 || depth[i] === 2100 || depth[i] === 3000) svAt[String(depth[i])] = mpa(sv);
  }
  return { file, svAt };
}

function writeSurvey(): string {
  const file = 'HF-3_survey.csv';
  const lines = ['Well,HF-3', `Field,${FIELD}`, `Contractor,${CONTRACTOR}`, `Note,${NOTE}`, '', 'MD (m),Inclination (deg),Azimuth (deg)'];
  for (let md = 0; md <= 4000; md += 30) {
    const inc = (hf3Inclination(md) * 180) / Math.PI;
    lines.push(`${md.toFixed(1)},${inc.toFixed(2)},${(inc > 0 ? HF3.azimuth : 0).toFixed(2)}`);
  }
  writeFileSync(join(ROOT, file), lines.join('\n') + '\n');
  return file;
}

function writeBroken(): { file: string; problem: string; expectedError: string }[] {
  mkdirSync(join(ROOT, 'broken'), { recursive: true });
  const { record } = generateSyntheticTest({ type: 'lot', depthTvd: 1300, shmin: shminAt(1300), mudDensity: mudDensityAt(1300), seed: 900, metadata: { well: 'HF-2', date: '2026-03-05' } });
  const base = recordToDelimited(record, 'comma-psi-bbl').split('\n');
  const header = base.findIndex((l) => l.startsWith('Elapsed Time'));
  const out: { file: string; problem: string; expectedError: string }[] = [];

  const nonNumeric = [...base];
  const cells = nonNumeric[header + 121].split(',');
  cells[1] = '12O4.5';
  nonNumeric[header + 121] = cells.join(',');
  writeFileSync(join(ROOT, 'broken', 'non-numeric-cell.csv'), nonNumeric.join('\n'));
  out.push({ file: 'broken/non-numeric-cell.csv', problem: `pressure cell "12O4.5" (letter O) on line ${header + 122}, column 2`, expectedError: 'non-numeric-cell' });

  const backwards = [...base];
  const row = backwards[header + 301].split(',');
  const previous = backwards[header + 300].split(',')[0];
  row[0] = (Number(row[0]) - 50).toFixed(1);
  backwards[header + 301] = row.join(',');
  writeFileSync(join(ROOT, 'broken', 'time-backwards.csv'), backwards.join('\n'));
  out.push({ file: 'broken/time-backwards.csv', problem: `elapsed time ${row[0]} s after ${previous} s on line ${header + 302}, column 1`, expectedError: 'time-not-increasing' });

  const unknown = [...base];
  unknown[header] = 'Elapsed Time (s),Pressure (pqi),Rate (bbl/min),Volume (bbl)';
  writeFileSync(join(ROOT, 'broken', 'unknown-unit.csv'), unknown.join('\n'));
  out.push({ file: 'broken/unknown-unit.csv', problem: `pressure unit "pqi" in the header on line ${header + 1}, column 2`, expectedError: 'unknown-unit' });
  return out;
}

function folderSize(dir: string): number {
  let total = 0;
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    const s = statSync(p);
    total += s.isDirectory() ? folderSize(p) : s.size;
  }
  return total;
}

async function main(): Promise<void> {
  rmSync(ROOT, { recursive: true, force: true });
  mkdirSync(ROOT, { recursive: true });
  const manifest: Record<string, unknown>[] = [];
  const density = writeDensityLog();
  let seed = 100;
  for (const t of TESTS) {
    seed += 1;
    const md = t.well === 'HF-3' ? +hf3MdForTvd(t.tvd).toFixed(1) : t.tvd;
    const mud = t.type === 'srt' ? 1000 : mudDensityAt(t.tvd);
    const flaws: SyntheticFlaws = { ...t.flaws };
    const { record, truth } = generateSyntheticTest({
      type: t.type,
      seed,
      depthTvd: t.tvd,
      mudDensity: mud,
      gaugePosition: t.gauge ?? 'surface',
      shmin: shminAt(t.tvd),
      porePressure: FIELD_MODEL.ppGradient * t.tvd,
      cycles: t.cycles,
      sampleInterval: t.sampleInterval ?? 1,
      noiseSd: t.gauge === 'downhole' ? 1.5e3 : 3e3,
      ...(t.gaugeResolution ? { gaugeResolution: t.gaugeResolution } : {}),
      systemVolume: 40 + t.tvd * 0.012,
      compressibility: 6e-10,
      flaws,
      fileName: fileName(t),
      metadata: {
        well: t.well, date: t.date, depthMd: md as never,
        casingShoeTvd: (t.tvd - 4) as never,
        holeDiameter: (t.tvd < 1500 ? 0.31115 : 0.2159) as never,
        openHoleLength: 4 as never,
        mudType: 'water-based',
        extra: { Formation: formationAt(t.tvd), Note: NOTE },
      },
    });
    delete (record.metadata as { porePressure?: number }).porePressure;
    const name = fileName(t);
    const path = join(ROOT, name);
    if (t.format === 'las') writeFileSync(path, withLasFormation(recordToLas(record), formationAt(t.tvd)));
    else if (t.format === 'xlsx-kpa') await writeWorkbook(path, record, 'kpa');
    else if (t.format === 'xlsx-psi') await writeWorkbook(path, record, 'psi');
    else writeFileSync(path, recordToDelimited(record, t.format, { startTime: `${t.date}T09:00:00Z`, title: `${CONTRACTOR} - pressure test report` }));
    const flawList = [...Object.entries(flaws).map(([k, v]) => (typeof v === 'string' ? v : k)), ...(t.sampleInterval && t.sampleInterval > 1 ? [t.sampleInterval >= 5 ? 'sparseSampling' : `sampled every ${t.sampleInterval} s`] : [])];
    manifest.push({
      file: name,
      well: t.well,
      type: t.type,
      format: t.format,
      depthTvd: { value: t.tvd, unit: 'm' },
      depthMd: { value: md, unit: 'm' },
      gauge: t.gauge ?? 'surface',
      mudDensity: { value: mud, unit: 'kg/m3' },
      samples: record.time.length,
      sampleInterval: { value: t.sampleInterval ?? 1, unit: 's' },
      flaws: flawList,
      intendedFindings: flawList.flatMap((f) => FLAW_FINDINGS[f] ?? []),
      truth: truthForManifest(truth, t.tvd),
      ...(t.well === 'HF-6' && density.svAt[String(t.tvd)] ? { verticalStressFromDensityLog: density.svAt[String(t.tvd)] } : {}),
    });
  }
  const survey = writeSurvey();
  const broken = writeBroken();
  const doc = {
    description: 'Invented demonstration data: the Harrow Flats field, wells HF-1 to HF-6, tests by Cobalt Ridge Test Services. No real wells, people or companies.',
    safety: SAFETY,
    generator: 'npx tsx scripts/make-demo.ts (seeded, deterministic)',
    stressField: {
      shmin: 'Shmin = 1.0 MPa + 16.5 kPa/m x TVD',
      porePressure: 'Pp = 10.0 kPa/m x TVD (hydrostatic)',
      verticalStress: 'Sv = 1 psi/ft = 22.62 kPa/m x TVD (HF-6 density log integrates to about this)',
      shmaxFromReopening: 'reopening set at Shmin + 0.8 MPa, so SHmax = 3 Shmin - Pr - Pp = 2 Shmin - Pp - 0.8 MPa',
      events: 'ISIP Shmin + 0.5 MPa; propagation + 1.2 MPa; leak-off + 1.5 MPa (LOT + 0.6 MPa); breakdown + 4.8 MPa; SRT extension + 0.3 MPa',
    },
    tests: manifest,
    logs: [{ file: density.file, well: 'HF-6', curve: 'RHOB', unit: 'g/cm3', index: 'TVD m', note: 'no readings above 150 m (null -999.25)' }],
    surveys: [{ file: survey, well: 'HF-3', profile: 'vertical to 800 m MD, build 2 deg/30 m to 35 deg at azimuth 62 deg, hold' }],
    broken,
  };
  writeFileSync(join(ROOT, 'manifest.json'), JSON.stringify(doc, null, 2) + '\n');
  writeFileSync(join(ROOT, 'README.md'), readme(manifest.length));
  const size = folderSize(ROOT);
  process.stderr.write(`demo: ${manifest.length} tests, ${(size / 1e6).toFixed(2)} MB\n`);
  if (size > 3e6) throw new Error(`demo folder is ${(size / 1e6).toFixed(2)} MB, over 3 MB`);
}

function readme(count: number): string {
  return `# Demo data: the Harrow Flats field

**Everything in this folder is invented.** Harrow Flats, wells HF-1 to HF-6 and Cobalt Ridge
Test Services do not exist; no real well, person or company is described. The files exist
to show and test Stress Ledger's import, analysis, grading and regional model.

${SAFETY}

## What is here

- ${count} pressure tests (FIT, LOT, XLOT with 2 to 4 cycles, step-rate, DFIT) at casing shoes
  from 620 m to 3500 m TVD, in the layouts contractors send:
  - \`*.csv\` comma-separated, metadata block, units in the headers (psi, bbl/min, bbl, elapsed s);
  - \`*.csv\` semicolon-separated with decimal commas, a second header row of units (kPa, m3/min,
    m3, elapsed minutes);
  - \`*.txt\` tab-separated with ISO 8601 timestamps (bar, L/min, L);
  - \`*.xlsx\` workbooks with metadata cells above the table;
  - \`*.las\` LAS 2.0 time-indexed gauge exports (downhole gauges).
- \`HF-6_density.las\`: a depth-indexed bulk-density log (RHOB, g/cm3) for the vertical stress.
- \`HF-3_survey.csv\`: the directional survey (MD, inclination, azimuth) of the deviated well HF-3.
- \`broken/\`: three files that must be refused with a clear error (a non-numeric cell, time
  going backwards, an unknown unit).
- \`manifest.json\`: for every file, the well, test type, layout, flaws and the truth the
  records were built with (Shmin, Pp, Sv, every event pressure and time, downhole, MPa).

## The invented stress field

Shmin = 1.0 MPa + 16.5 kPa/m x TVD; Pp hydrostatic 10.0 kPa/m; Sv 1 psi/ft (22.62 kPa/m).
Reopening is set 0.8 MPa above Shmin, so the reopening relation gives SHmax = 2 Shmin - Pp - 0.8 MPa.

## Deliberate flaws

Air in the line (HF-2 1900 m), bad second cycle (HF-2 3100 m: reopening above breakdown;
HF-6 2100 m: second shut-in of 90 s only), leaking shut-in (HF-3 1200 m), clipped gauge
(HF-3 2250 m), sparse 10 s sampling (HF-4 2800 m), unsteady rate (HF-5 1000 m). The
manifest names the quality criterion each flaw should fail.

Regenerate with \`npx tsx scripts/make-demo.ts\` (deterministic; workbook files differ only in
their zip timestamps).
`;
}

main().catch((e: unknown) => {
  process.stderr.write(`${e instanceof Error ? e.stack ?? e.message : String(e)}\n`);
  process.exit(1);
});
