import { z } from 'zod';
import { ArchiveError } from './errors';

/**
 * The full-archive backup file: every table, every row, restored exactly.
 *
 * Layout (little-endian):
 *   8 bytes   magic "SLBACKUP"
 *   4 bytes   header length H (uint32)
 *   H bytes   header, UTF-8 JSON: {format, formatVersion, schemaVersion, createdAt, notice,
 *             tables: {name: rows[]}, blobs: [{type, offset, length}]}
 *   ...       binary section: the typed arrays the rows held, each 8-byte aligned
 *
 * Inside rows, a typed array is written as {"$sl:bin": index} (index into `blobs`) and a
 * number JSON cannot carry (NaN, +-Infinity, -0) as {"$sl:num": "NaN" | "Infinity" | "-Infinity" | "-0"}.
 */

export type TableDump = Record<string, unknown[]>;

const MAGIC = 'SLBACKUP';
export const BACKUP_FORMAT_VERSION = 1;
const BIN = '$sl:bin';
const NUM = '$sl:num';

const BINARY_TYPES = {
  Float64Array, Float32Array, Int32Array, Uint32Array, Int16Array, Uint16Array, Int8Array, Uint8Array,
} as const;
type BinaryTypeName = keyof typeof BINARY_TYPES;

const headerSchema = z.object({
  format: z.literal('stress-ledger-backup'),
  formatVersion: z.number().int(),
  schemaVersion: z.number().int().positive(),
  createdAt: z.string(),
  notice: z.string(),
  tables: z.record(z.string(), z.array(z.unknown())),
  blobs: z.array(z.object({
    type: z.enum(Object.keys(BINARY_TYPES) as [BinaryTypeName, ...BinaryTypeName[]]),
    offset: z.number().int().nonnegative(),
    length: z.number().int().nonnegative(),
  })),
});

/** Encode table dumps into one backup file. */
export function encodeBackup(tables: TableDump, schemaVersion: number, createdAt: string): Uint8Array {
  const blobs: { type: BinaryTypeName; offset: number; length: number }[] = [];
  const parts: Uint8Array[] = [];
  let offset = 0;
  const replace = (value: unknown): unknown => {
    if (typeof value === 'number') return Number.isFinite(value) && !Object.is(value, -0) ? value : { [NUM]: Object.is(value, -0) ? '-0' : String(value) };
    if (ArrayBuffer.isView(value)) {
      const type = (Object.keys(BINARY_TYPES) as BinaryTypeName[]).find((name) => value instanceof BINARY_TYPES[name]);
      if (!type) throw new ArchiveError('bad-argument', `Cannot back up a ${value.constructor.name}.`);
      const bytes = new Uint8Array(value.buffer, value.byteOffset, value.byteLength).slice();
      const aligned = Math.ceil(offset / 8) * 8;
      if (aligned > offset) parts.push(new Uint8Array(aligned - offset));
      blobs.push({ type, offset: aligned, length: bytes.byteLength });
      parts.push(bytes);
      offset = aligned + bytes.byteLength;
      return { [BIN]: blobs.length - 1 };
    }
    if (Array.isArray(value)) return value.map(replace);
    if (value && typeof value === 'object') {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(value)) if (v !== undefined) out[k] = replace(v);
      return out;
    }
    return value;
  };
  const encodedTables: TableDump = {};
  for (const [name, rows] of Object.entries(tables)) encodedTables[name] = rows.map(replace);
  const header = new TextEncoder().encode(JSON.stringify({
    format: 'stress-ledger-backup', formatVersion: BACKUP_FORMAT_VERSION, schemaVersion, createdAt,
    notice: 'Stress Ledger archive backup. Results in it are for review by a qualified engineer, are not a substitute for the operator\'s well-control policy, and defer to local regulations and licensed practice.',
    tables: encodedTables, blobs,
  }));
  const out = new Uint8Array(MAGIC.length + 4 + header.length + offset);
  out.set(new TextEncoder().encode(MAGIC), 0);
  new DataView(out.buffer).setUint32(MAGIC.length, header.length, true);
  out.set(header, MAGIC.length + 4);
  let at = MAGIC.length + 4 + header.length;
  for (const part of parts) { out.set(part, at); at += part.length; }
  return out;
}

/**
 * Decode a backup file. Throws ArchiveError 'bad-backup' when the file is not a backup or
 * is damaged, 'backup-version' when it was written by another schema version.
 */
export function decodeBackup(bytes: Uint8Array, expectedSchemaVersion: number): { tables: TableDump; schemaVersion: number; createdAt: string } {
  if (bytes.length < MAGIC.length + 4 || new TextDecoder().decode(bytes.subarray(0, MAGIC.length)) !== MAGIC) {
    throw new ArchiveError('bad-backup', 'This file is not a Stress Ledger backup (its first bytes are not "SLBACKUP").');
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const headerLength = view.getUint32(MAGIC.length, true);
  const binaryStart = MAGIC.length + 4 + headerLength;
  if (binaryStart > bytes.length) throw new ArchiveError('bad-backup', 'The backup is truncated: its header runs past the end of the file.');
  let parsed: unknown;
  try {
    parsed = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes.subarray(MAGIC.length + 4, binaryStart)));
  } catch {
    throw new ArchiveError('bad-backup', 'The backup header is not valid UTF-8 JSON.');
  }
  const result = headerSchema.safeParse(parsed);
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new ArchiveError('bad-backup', `The backup header is damaged at ${issue.path.join('.') || 'the top level'}: ${issue.message}.`);
  }
  const header = result.data;
  if (header.formatVersion !== BACKUP_FORMAT_VERSION) {
    throw new ArchiveError('backup-version', `Backup format ${header.formatVersion} is not supported (this version reads format ${BACKUP_FORMAT_VERSION}).`);
  }
  if (header.schemaVersion !== expectedSchemaVersion) {
    throw new ArchiveError('backup-version', `The backup holds archive schema ${header.schemaVersion}; this version restores schema ${expectedSchemaVersion}.`);
  }
  const binaryLength = bytes.length - binaryStart;
  const revive = (value: unknown): unknown => {
    if (Array.isArray(value)) return value.map(revive);
    if (value && typeof value === 'object') {
      const record = value as Record<string, unknown>;
      const keys = Object.keys(record);
      if (keys.length === 1 && keys[0] === BIN) {
        const blob = header.blobs[record[BIN] as number];
        if (!blob || blob.offset + blob.length > binaryLength) throw new ArchiveError('bad-backup', 'The backup refers to binary data it does not hold.');
        const Type = BINARY_TYPES[blob.type];
        const copy = bytes.slice(binaryStart + blob.offset, binaryStart + blob.offset + blob.length);
        if (blob.length % Type.BYTES_PER_ELEMENT !== 0) throw new ArchiveError('bad-backup', 'A binary block of the backup has a wrong length.');
        return new Type(copy.buffer, 0, blob.length / Type.BYTES_PER_ELEMENT);
      }
      if (keys.length === 1 && keys[0] === NUM) {
        const text = record[NUM];
        if (text === '-0') return -0;
        if (text === 'NaN' || text === 'Infinity' || text === '-Infinity') return Number(text);
        throw new ArchiveError('bad-backup', 'The backup holds an unreadable number.');
      }
      const out: Record<string, unknown> = {};
      for (const k of keys) out[k] = revive(record[k]);
      return out;
    }
    return value;
  };
  const tables: TableDump = {};
  for (const [name, rows] of Object.entries(header.tables)) tables[name] = rows.map(revive);
  return { tables, schemaVersion: header.schemaVersion, createdAt: header.createdAt };
}
