/**
 * Import of delimited text as contractors send it: comma, semicolon, tab or aligned spaces; point or comma
 * decimal mark; a metadata block; units in the header or a units row; elapsed time, clock
 * times or ISO timestamps; CRLF or LF; UTF-8 (BOM or not), UTF-16 or Windows-1252.
 *
 * Only the head (first 256 KiB) is decoded to text to find the layout; the body is read
 * from bytes (delimitedBody.ts).
 */
import type { SourceLocation } from '../errors';
import type { TestRecord } from '../record';
import { scanDelimitedBody, type BodyColumn } from './delimitedBody';
import type { ImportOptions } from './importOptions';
import type { PlannedColumn } from './columnPlan';
import { buildTestRecord, type RawRole } from './recordBuilder';
import { planTableColumns, previewOfTable, readTableHead, type TablePreview } from './tableHead';
import { detectDecimalMark, detectDelimiter, respaceHeader, splitLine, type TableDelimiter } from './tableLayout';
import { asciiCompatibleBytes, decodeAsciiCompatible, type DetectedEncoding } from './textEncoding';

const HEAD_BYTES = 256 * 1024;
const LF = 10;
const CR = 13;

/** The decoded head of a delimited file. */
interface DelimitedHead {
  bytes: Uint8Array;
  encoding: DetectedEncoding;
  rows: string[][];
  delimiter: TableDelimiter;
}

/** Decodes the head and splits it into rows of cells. */
function readDelimitedHead(input: Uint8Array, fileName: string): DelimitedHead {
  const { bytes, encoding } = asciiCompatibleBytes(input, fileName);
  let cut = bytes.length;
  if (cut > HEAD_BYTES) {
    cut = bytes.lastIndexOf(LF, HEAD_BYTES) + 1 || HEAD_BYTES;
  }
  const text = decodeAsciiCompatible(bytes.subarray(0, cut), encoding.encoding);
  const lines = text.split(/\r\n|\r|\n/);
  if (cut < bytes.length) lines.pop();
  const delimiter = detectDelimiter(lines);
  const rows = lines.map((l) => splitLine(l, delimiter));
  if (delimiter === ' ') respaceHeader(rows, lines);
  return { bytes, encoding, rows, delimiter };
}

/** Byte offset where line `index` (0-based) starts; a CRLF, CR or LF ends a line. */
function offsetOfLine(bytes: Uint8Array, index: number): number {
  let line = 0;
  let i = 0;
  while (line < index && i < bytes.length) {
    const b = bytes[i++];
    if (b === LF) line++;
    else if (b === CR) {
      if (bytes[i] === LF) i++;
      line++;
    }
  }
  return i;
}

function cellLocator(fileName: string) {
  return (row: number, column: number): SourceLocation => ({ file: fileName, line: row + 1, column: column + 1 });
}

/**
 * Reads a delimited-text test file into the normalised SI record.
 *
 * @param bytes file content
 * @param fileName shown in errors and kept in `source`
 * @param options forced mapping, type, metadata overrides, allowMissingRateAndVolume
 * @returns the record (time s from 0, pressure Pa, rate m3/s, volume m3)
 * @throws EngineError with file, line and column: 'empty-table', 'no-time-column',
 *   'no-pressure-column', 'unknown-unit', 'non-numeric-cell', 'ragged-row',
 *   'time-not-increasing', 'out-of-range', 'no-rate-or-volume', 'bad-metadata', 'bad-encoding'
 * @example parseDelimitedTest(new TextEncoder().encode('Time (s),Pressure (kPa),Rate (L/min)\n0,100,0\n1,200,50\n'), 'a.csv')
 */
export function parseDelimitedTest(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): TestRecord {
  const head = readDelimitedHead(bytes, fileName);
  const locate = cellLocator(fileName);
  const table = readTableHead(head.rows, 'delimited', locate);
  const { dataStart, headerRow } = table.layout;
  const decimalMark = detectDecimalMark(head.rows.slice(dataStart, dataStart + 50), head.delimiter);
  const plan = planTableColumns(table, head.rows, options, locate);
  const wanted: [RawRole, PlannedColumn | null][] = [['time', plan.time], ['pressure', plan.pressure], ['rate', plan.rate], ['volume', plan.volume]];
  const present = wanted.filter((w): w is [RawRole, PlannedColumn] => w[1] !== null);
  const bodyColumns: BodyColumn[] = present.map(([role, c]) => ({
    field: c.index, kind: c.kind, required: role === 'time' || role === 'pressure', expected: `${role} in ${c.unit}`,
  }));
  const body = scanDelimitedBody(head.bytes, offsetOfLine(head.bytes, dataStart), dataStart + 1, head.delimiter.charCodeAt(0),
    decimalMark.charCodeAt(0), table.layout.width, bodyColumns, fileName);
  const valueOf = (role: RawRole) => {
    const k = present.findIndex((p) => p[0] === role);
    return k < 0 ? null : body.values[k];
  };
  const columnOf = (role: RawRole) => present.find((p) => p[0] === role)![1].index;
  return buildTestRecord({
    fileName, format: 'delimited', time: valueOf('time')!, timeKind: plan.time.kind, timeUnit: plan.time.unit,
    pressure: valueOf('pressure')!, pressureUnit: plan.pressure.unit,
    rate: valueOf('rate'), rateUnit: plan.rate?.unit ?? '', volume: valueOf('volume'), volumeUnit: plan.volume?.unit ?? '',
    columns: plan.columns, layout: table.signature, metadata: table.reading.metadata,
    warnings: [...table.reading.warnings, ...plan.warnings],
    locate: (row, role) => (row < 0
      ? locate(headerRow ?? dataStart, columnOf(role))
      : { file: fileName, line: body.lineOfRow(row), column: columnOf(role) + 1 }),
    firstTimeText: head.rows[dataStart][plan.time.index],
    sourceExtras: { delimiter: head.delimiter, decimalMark },
  }, options);
}

/**
 * Preview of a delimited file for the import confirmation screen: header, detected column
 * roles and units, metadata, first 20 data rows; only the head is read.
 *
 * @param bytes file content
 * @param fileName for errors and the preview
 * @param options a mapping to try
 * @returns the preview (with `problem` when the file would not import as it stands)
 * @throws EngineError 'empty-table', 'bad-encoding', metadata errors
 * @example previewDelimited(bytes, 'a.csv').columns
 */
export function previewDelimited(bytes: Uint8Array, fileName: string, options: ImportOptions = {}): TablePreview {
  const head = readDelimitedHead(bytes, fileName);
  const locate = cellLocator(fileName);
  const table = readTableHead(head.rows, 'delimited', locate);
  const decimalMark = detectDecimalMark(head.rows.slice(table.layout.dataStart, table.layout.dataStart + 50), head.delimiter);
  const preview = previewOfTable(table, head.rows, { fileName, format: 'delimited' }, options, locate);
  return { ...preview, delimiter: head.delimiter, decimalMark };
}
