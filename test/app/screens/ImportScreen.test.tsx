import { describe, expect, it } from 'vitest';
import { importButtonWords } from '../../../src-renderer/app/screens/ImportScreen';

describe('import button', () => {
  it('should count only readable files and name the unreadable ones beside them', () => {
    // Counting rule set here (common practice for batch dialogs): the button promises only what it can enter.
    expect(importButtonWords(2, 1)).toBe('Import 2 files (1 cannot be read)');
    expect(importButtonWords(1, 0)).toBe('Import 1 file');
    expect(importButtonWords(0, 3)).toBe('Nothing readable to import (3 cannot be read)');
    expect(importButtonWords(0, 0)).toBe('Nothing left to import');
  });
});
