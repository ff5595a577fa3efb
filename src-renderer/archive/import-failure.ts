import type { ImportOutcome } from './api';

/**
 * The per-file failure of an import, from whatever was thrown: an EngineError (possibly
 * rebuilt after crossing a worker boundary, so matched by shape), an ArchiveError, a
 * Dexie/IndexedDB error, or anything else.
 */
export function describeImportFailure(error: unknown, fileName: string): NonNullable<ImportOutcome['error']> {
  if (error && typeof error === 'object') {
    const e = error as { code?: unknown; message?: unknown; name?: unknown; location?: { line?: unknown; column?: unknown }; line?: unknown; column?: unknown };
    const code = typeof e.code === 'string' ? e.code : typeof e.name === 'string' && e.name !== 'Error' ? `storage:${e.name}` : 'internal';
    const message = typeof e.message === 'string' && e.message ? e.message : `${fileName} could not be imported.`;
    const line = numberOrUndefined(e.location?.line ?? e.line);
    const column = numberOrUndefined(e.location?.column ?? e.column);
    return { code, message, ...(line !== undefined ? { line } : {}), ...(column !== undefined ? { column } : {}) };
  }
  return { code: 'internal', message: `${fileName} could not be imported: ${String(error)}` };
}

function numberOrUndefined(value: unknown): number | undefined {
  return typeof value === 'number' && Number.isFinite(value) ? value : undefined;
}
