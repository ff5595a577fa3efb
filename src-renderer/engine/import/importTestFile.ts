/** Alias module of import-test-file.ts (both spellings are imported across the code base). */
export * from './import-test-file';
