/**
 * Interpretation of metadata entries into the SI TestMetadata of record.ts: depths, mud
 * density, diameters, volumes, compressibility, gauge position, test type ... each with the
 * unit in the value ("2033 m") or in the key ("TVD (m)"), range-checked.
 */
import { EngineError } from '../errors';
import type { TestMetadata, TestType } from '../record';
import { splitHeaderUnit } from './columnRoles';
import type { MetadataEntry } from './metadataEntries';
import { checkRange, PHYSICAL_RANGES } from './physicalRanges';
import { parseQuantity, type QuantityKind } from '../units/parseQuantity';
import { STANDARD_GRAVITY } from '../units/quantity';

/** Units the metadata block states for table columns ("Pressure units: psi"). */
export interface UnitHints {
  pressure?: string;
  rate?: string;
  volume?: string;
  time?: string;
  depth?: string;
}

/** Metadata read from a block, with the notes made while reading it. */
export interface MetadataReading {
  metadata: TestMetadata;
  unitHints: UnitHints;
  warnings: string[];
}

type NumericField = 'depthTvd' | 'depthMd' | 'casingShoeMd' | 'casingShoeTvd' | 'holeDiameter' | 'casingInnerDiameter'
  | 'openHoleLength' | 'systemVolume' | 'surfaceLineVolume' | 'compressibility' | 'gaugeRange' | 'gaugeResolution' | 'mudDensity';

interface NumericRule { test: RegExp; field: NumericField; kind: QuantityKind; defaultUnit?: string }

/** Key patterns (lower case, unit removed) of the numeric fields; first match wins. */
const NUMERIC_RULES: readonly NumericRule[] = [
  { test: /shoe.*(tvd|vertical)|(tvd|vertical).*shoe/, field: 'casingShoeTvd', kind: 'length' },
  { test: /shoe/, field: 'casingShoeMd', kind: 'length' },
  { test: /\btvd\b|true vertical/, field: 'depthTvd', kind: 'length' },
  { test: /\bmd\b|measured depth/, field: 'depthMd', kind: 'length' },
  { test: /hole (size|diameter)|bit (size|diameter)/, field: 'holeDiameter', kind: 'length', defaultUnit: 'in' },
  { test: /casing (id|i d|inner diameter|inside diameter)/, field: 'casingInnerDiameter', kind: 'length', defaultUnit: 'in' },
  { test: /open ?hole length|rat ?hole|new hole/, field: 'openHoleLength', kind: 'length' },
  { test: /surface (line )?volume|line volume/, field: 'surfaceLineVolume', kind: 'volume' },
  { test: /system volume|volume under (compression|pressure)|compressed volume|pressuri[sz]ed volume|well volume/, field: 'systemVolume', kind: 'volume' },
  { test: /compressibility/, field: 'compressibility', kind: 'compressibility' },
  { test: /gauge (range|full scale|capacity)/, field: 'gaugeRange', kind: 'pressure' },
  { test: /(gauge )?resolution/, field: 'gaugeResolution', kind: 'pressure' },
  { test: /mud (weight|density|wt)|fluid (weight|density)|^mw$|^density$/, field: 'mudDensity', kind: 'density' },
];

const TEXT_RULES: readonly { test: RegExp; apply: (m: TestMetadata, v: string) => void }[] = [
  { test: /^(well( name| id)?|wellbore( name)?)$/, apply: (m, v) => { m.well = v; } },
  { test: /^field( name)?$/, apply: (m, v) => { m.field = v; } },
  { test: /^(contractor|service company|test company|company|pumping company)$/, apply: (m, v) => { m.contractor = v; } },
  { test: /^((mud|fluid) (type|system)|mud)$/, apply: (m, v) => { m.mudType = v; } },
  { test: /^(formation( name)?|tested formation|formation tested|(tested )?zone|form)$/, apply: (m, v) => { m.formation = v; } },
];

const UNIT_HINT = /^(pressure|rate|volume|time|depth) units?$/;

/**
 * Reads metadata entries into SI metadata. Unknown keys go to `extra`.
 *
 * @param entries entries from the metadata block
 * @returns metadata, unit hints for the table and warnings
 * @throws EngineError 'unknown-unit' for a depth, volume or pressure without a usable unit;
 *   'out-of-range' for a value outside PHYSICAL_RANGES; 'bad-metadata' for an unreadable value
 * @example readMetadataEntries([{key:'TVD', value:'2033 m', location:{line:3}}]).metadata.depthTvd // 2033
 */
export function readMetadataEntries(entries: readonly MetadataEntry[]): MetadataReading {
  const reading: MetadataReading = { metadata: {}, unitHints: {}, warnings: [] };
  const deferred: MetadataEntry[] = [];
  for (const entry of entries) {
    const { name, unit } = splitHeaderUnit(entry.key);
    const key = name.toLowerCase().replace(/[_.]+/g, ' ').replace(/\s+/g, ' ').trim();
    if (/pore pressure|^pp$|formation pressure|vertical stress|overburden|^sv$/.test(key)) deferred.push(entry);
    else readOneEntry(entry, key, unit, reading);
  }
  for (const entry of deferred) readStressEntry(entry, reading);
  return reading;
}

function readOneEntry(entry: MetadataEntry, key: string, keyUnit: string, reading: MetadataReading): void {
  const { metadata } = reading;
  const hint = UNIT_HINT.exec(key);
  if (hint) {
    reading.unitHints[hint[1] as keyof UnitHints] = entry.value.trim();
    return;
  }
  const text = TEXT_RULES.find((r) => r.test.test(key));
  if (text) return text.apply(metadata, entry.value.trim());
  if (/^(test )?type( of test)?$|^test$|^test kind$/.test(key)) return readTestType(entry, metadata, reading);
  if (/^(test )?date$|^date of test$/.test(key)) return readDate(entry, metadata, reading);
  if (/gauge (position|location|placement)|pressure measured at|^gauge$/.test(key)) return readGaugePosition(entry, metadata);
  const rule = NUMERIC_RULES.find((r) => r.test.test(key));
  if (rule) return readNumericEntry(entry, rule, keyUnit, reading);
  if (/depth/.test(key)) reading.warnings.push(`"${entry.key}" does not say TVD or MD; kept as written, not used`);
  (metadata.extra ??= {})[entry.key] = entry.value;
}

/** Value text with the key's unit appended when the value has none. */
function valueWithUnit(value: string, keyUnit: string, fallbackUnit: string | undefined): { text: string; assumed: boolean } {
  const v = expandFraction(value.trim());
  const hasUnit = /[A-Za-z"'/³]/.test(v.replace(/^[+-]?[\d.,]+(e[+-]?\d+)?/i, ''));
  if (hasUnit) return { text: v, assumed: false };
  if (keyUnit) return { text: `${v} ${keyUnit}`, assumed: false };
  if (fallbackUnit) return { text: `${v} ${fallbackUnit}`, assumed: true };
  return { text: v, assumed: false };
}

/** "12 1/4 in" or "8-1/2" (diameters) to decimal inches text. */
function expandFraction(value: string): string {
  const m = /^(\d+)[\s-]+(\d+)\/(\d+)\s*(.*)$/.exec(value);
  return m ? `${+m[1] + +m[2] / +m[3]} ${m[4] || 'in'}` : value;
}

function readNumericEntry(entry: MetadataEntry, rule: NumericRule, keyUnit: string, reading: MetadataReading): void {
  const fallback = rule.field === 'mudDensity' ? densityUnitByMagnitude(entry.value) : rule.defaultUnit
    ?? (rule.kind === 'length' ? reading.unitHints.depth : undefined);
  const { text, assumed } = valueWithUnit(entry.value, keyUnit, fallback);
  if (!/[A-Za-z"'/³]/.test(text.replace(/^[+-]?[\d.,]+(e[+-]?\d+)?/i, ''))) {
    throw new EngineError('unknown-unit', `"${entry.key}" has no unit`, entry.location, `a ${rule.kind} with its unit, e.g. "2033 m" or "6670 ft"`);
  }
  const parsed = parseQuantityAt(text, rule.kind, entry);
  if (assumed) reading.warnings.push(`"${entry.key}" = "${entry.value}" has no unit; ${fallback} assumed`);
  const range = PHYSICAL_RANGES[rule.field];
  if (range) checkRange(parsed.value, range, entry.location);
  (reading.metadata as Record<string, unknown>)[rule.field] = parsed.value;
}

function parseQuantityAt(text: string, kind: QuantityKind, entry: MetadataEntry) {
  try {
    return parseQuantity(text, kind, entry.location);
  } catch (e) {
    if (e instanceof EngineError && e.code === 'bad-argument') {
      throw new EngineError('bad-metadata', `"${entry.key}" = "${entry.value}" is not a number with a unit`, entry.location, `a ${kind} such as "2033 m"`);
    }
    throw e;
  }
}

/** Mud density written without a unit: sg for 0.5-3, ppg for 4-25, kg/m3 for 500-3000 (ranges do not overlap). */
function densityUnitByMagnitude(value: string): string | undefined {
  const v = Number(value.trim().replace(',', '.'));
  if (v >= 0.5 && v <= 3) return 'sg';
  if (v >= 4 && v <= 25) return 'ppg';
  if (v >= 500 && v <= 3000) return 'kg/m3';
  return undefined;
}

function readTestType(entry: MetadataEntry, metadata: TestMetadata, reading: MetadataReading): void {
  const type = testTypeFromText(entry.value);
  if (type) metadata.testType = type;
  else reading.warnings.push(`test type "${entry.value}" not recognised; it will be inferred`);
}

/**
 * Test type from text as written ("LOT", "Extended leak-off test", "Step rate", "mini-frac").
 *
 * @param text the text
 * @returns the type id, or null
 * @example testTypeFromText('Formation integrity test') // 'fit'
 */
export function testTypeFromText(text: string): TestType | null {
  const t = text.toLowerCase();
  if (/\bxlot\b|extended leak/.test(t)) return 'xlot';
  if (/\bdfit\b|mini ?-?frac|diagnostic fracture/.test(t)) return 'dfit';
  if (/\bsrt\b|step ?-?rate/.test(t)) return 'srt';
  if (/\bfit\b|formation integrity|\bpit\b/.test(t)) return 'fit';
  if (/\blot\b|leak ?-?off/.test(t)) return 'lot';
  return null;
}

function readDate(entry: MetadataEntry, metadata: TestMetadata, reading: MetadataReading): void {
  const v = entry.value.trim();
  const iso = /^(\d{4}-\d{2}-\d{2})([T ]\d{2}:\d{2}(:\d{2})?)?/.exec(v);
  const dotted = /^(\d{1,2})\.(\d{1,2})\.(\d{4})$/.exec(v);
  if (iso) metadata.date = iso[0].replace(' ', 'T');
  else if (dotted) metadata.date = `${dotted[3]}-${dotted[2].padStart(2, '0')}-${dotted[1].padStart(2, '0')}`;
  else {
    (metadata.extra ??= {})[entry.key] = v;
    reading.warnings.push(`date "${v}" is not ISO 8601 (yyyy-mm-dd) or dd.mm.yyyy; kept as written`);
  }
}

function readGaugePosition(entry: MetadataEntry, metadata: TestMetadata): void {
  const v = entry.value.toLowerCase();
  if (/down ?hole|bottom ?hole|\bbh\b|\bdh\b|memory|at depth/.test(v)) metadata.gaugePosition = 'downhole';
  else if (/surface|pump|cement unit|stand ?pipe|wellhead/.test(v)) metadata.gaugePosition = 'surface';
  else throw new EngineError('bad-metadata', `gauge position "${entry.value}" not recognised`, entry.location, '"surface" or "downhole"');
}

/** Pore pressure or vertical stress: a pressure, a gradient, or an equivalent density (needs TVD). */
function readStressEntry(entry: MetadataEntry, reading: MetadataReading): void {
  const { name, unit } = splitHeaderUnit(entry.key);
  const field = /vertical|overburden|^sv$/i.test(name.trim()) ? 'verticalStress' : 'porePressure';
  const { text } = valueWithUnit(entry.value, unit, undefined);
  const parsed = parseQuantityAt(text, 'pressureOrGradient', entry);
  if (parsed.dimension === 'pressure') {
    reading.metadata[field] = parsed.value as TestMetadata['porePressure'];
    return;
  }
  const tvd = reading.metadata.depthTvd;
  if (tvd === undefined) {
    (reading.metadata.extra ??= {})[entry.key] = entry.value;
    reading.warnings.push(`"${entry.key}" is a gradient but the file gives no TVD; kept as written`);
    return;
  }
  checkRange(parsed.value / STANDARD_GRAVITY, PHYSICAL_RANGES.equivalentDensity, entry.location);
  reading.metadata[field] = (parsed.value * tvd) as TestMetadata['porePressure'];
}
