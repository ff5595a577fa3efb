import type { ArchiveErrorCode } from './api';

/**
 * The archive's typed error: a refused operation (four eyes, missing reason, wrong review
 * state, unknown id) or an unreadable backup. Screens switch on `code`.
 */
export class ArchiveError extends Error {
  readonly code: ArchiveErrorCode;

  constructor(code: ArchiveErrorCode, message: string) {
    super(message);
    this.name = 'ArchiveError';
    this.code = code;
  }
}

export function isArchiveError(e: unknown): e is ArchiveError {
  return e instanceof ArchiveError;
}
