/**
 * A small, fully specified engine for archive tests: reads "key: value" metadata lines
 * starting with '#', then rows "time_s,pressure_Pa,rate_m3s,volume_m3"; its analysis
 * picks the pressure maximum (fitMaximum) and grades by the number of samples against
 * the limit "minimumSamples". The truth of every record here is set by the test itself,
 * so the archive's behaviour (not the engine's methods) is what is checked.
 */
import { EngineError } from '../../../src-renderer/engine/errors';
import type { ArchiveEngine } from '../../../src-renderer/archive/engine-port';
import type { TestMetadata, TestRecord, TestType } from '../../../src-renderer/engine/record';
import type { AnalysisOptions } from '../../../src-renderer/engine/analysis-options';
import type { AnalysisResult, Grade, Pick } from '../../../src-renderer/engine/result';

export interface TestEngine extends ArchiveEngine {
  calls: { parse: number; analyse: number };
  /** The options of every parse call, in order. */
  parseOptions: unknown[];
  failAnalyseFor?: string;
}

export function createTestEngine(): TestEngine {
  const engine: TestEngine = {
    calls: { parse: 0, analyse: 0 },
    parseOptions: [],
    async parse(bytes, fileName, options) {
      engine.calls.parse += 1;
      engine.parseOptions.push(options);
      return parseSimpleCsv(new TextDecoder().decode(bytes), fileName);
    },
    analyse(record, options) {
      engine.calls.analyse += 1;
      if (engine.failAnalyseFor && record.source.fileName === engine.failAnalyseFor) {
        throw new EngineError('too-few-points', 'No loading cycle found', { file: record.source.fileName });
      }
      return analyseSimple(record, options);
    },
  };
  return engine;
}

export function parseSimpleCsv(text: string, fileName: string): TestRecord {
  const metadata: TestMetadata = {};
  const rows: number[][] = [];
  const lines = text.split(/\r?\n/);
  lines.forEach((line, i) => {
    if (!line.trim()) return;
    if (line.startsWith('#')) {
      const [key, ...rest] = line.slice(1).split(':');
      const value = rest.join(':').trim();
      const k = key.trim();
      if (k === 'well') metadata.well = value;
      else if (k === 'field') metadata.field = value;
      else if (k === 'type') metadata.testType = value as TestType;
      else if (k === 'tvd') metadata.depthTvd = Number(value) as TestMetadata['depthTvd'];
      else if (k === 'contractor') metadata.contractor = value;
      return;
    }
    const cells = line.split(',');
    const values = cells.map((c, j) => {
      const v = Number(c);
      if (!Number.isFinite(v)) throw new EngineError('non-numeric-cell', `"${c}" is not a number`, { file: fileName, line: i + 1, column: j + 1 }, 'a number');
      return v;
    });
    rows.push(values);
  });
  if (rows.length === 0) throw new EngineError('empty-table', 'No data rows', { file: fileName });
  const column = (j: number) => Float64Array.from(rows, (r) => r[j]);
  return {
    time: column(0), pressure: column(1), rate: column(2), volume: column(3), metadata,
    source: { fileName, format: 'delimited', layout: 'time|pressure|rate|volume', columns: [], derived: { rate: false, volume: false }, warnings: [] },
  };
}

function analyseSimple(record: TestRecord, options: AnalysisOptions): AnalysisResult {
  const metadata = { ...record.metadata, ...(options.overrides ?? {}) };
  let maxIndex = 0;
  for (let i = 1; i < record.pressure.length; i++) if (record.pressure[i] > record.pressure[maxIndex]) maxIndex = i;
  const auto: Pick = { kind: 'fitMaximum', pressure: record.pressure[maxIndex], time: record.time[maxIndex], method: 'maximum', sampleIndex: maxIndex };
  const picks: Partial<Record<Pick['kind'], Pick>> = { fitMaximum: auto };
  for (const manual of options.manualPicks ?? []) {
    if (manual.cycle !== 1) continue;
    if (manual.pick) picks[manual.kind] = manual.pick; else delete picks[manual.kind];
  }
  const minimumSamples = options.limits?.minimumSamples ?? 3;
  const grade: Grade = record.time.length >= minimumSamples ? 'A' : 'D';
  const shminPick = picks.fitMaximum ?? null;
  return {
    type: options.type ?? metadata.testType ?? 'fit',
    typeInferred: !options.type && !metadata.testType,
    typeReasons: ['stated in the test file or by the user'],
    samples: record.time.length,
    metadata,
    downholePressure: record.pressure,
    hydrostaticCorrection: 0,
    cycles: [{
      cycle: { index: 1, pumpStart: 0, pumpEnd: maxIndex, shutInEnd: record.time.length - 1, meanRate: 0, volumePumped: 0, flowBack: false },
      loadingFit: null, expectedSlope: null, picks, closureCandidates: [], closureSpread: null,
    }],
    stress: {
      shmin: shminPick ? { value: shminPick.pressure, kind: 'lower-bound', from: 'fitMaximum', cycle: 1 } : null,
      shmax: null,
      sv: { value: 0, source: 'default-gradient' },
      pp: { value: 0, source: 'default-gradient' },
      frictionCoefficient: 0.6,
      tensileStrength: null,
    },
    quality: {
      grade,
      criteria: [{ id: 'samples', pass: grade === 'A', value: record.time.length, limit: minimumSamples, message: 'sample count', severity: 'major' }],
      explanation: grade === 'A' ? 'enough samples' : 'too few samples',
    },
    warnings: [],
  };
}

/** A test file in the simple format, as bytes. */
export function simpleFile(name: string, well: string, options: { field?: string; tvd?: number; peak?: number; samples?: number; type?: TestType } = {}) {
  const lines = [`# well: ${well}`, `# field: ${options.field ?? 'Harrow Flats'}`, '# contractor: Cobalt Ridge Test Services'];
  if (options.tvd !== undefined) lines.push(`# tvd: ${options.tvd}`);
  if (options.type) lines.push(`# type: ${options.type}`);
  const n = options.samples ?? 5;
  const peak = options.peak ?? 30e6;
  for (let i = 0; i < n; i++) {
    const top = Math.max(1, Math.floor(n / 2));
    const p = i <= top ? (peak * i) / top : peak * 0.9;
    lines.push(`${i * 10},${p},${i <= top ? 0.001 : 0},${Math.min(i, top) * 0.01}`);
  }
  return { name, bytes: new TextEncoder().encode(lines.join('\n') + '\n') };
}

let counter = 0;
/** A fresh database name per test (fake-indexeddb keeps databases for the process). */
export function uniqueDatabaseName(): string {
  counter += 1;
  return `stress-ledger-test-${process.pid}-${counter}-${Math.random().toString(36).slice(2)}`;
}
