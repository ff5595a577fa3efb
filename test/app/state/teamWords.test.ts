import { describe, expect, it } from 'vitest';
import type { ApplyOutcome, TeamConflict } from '../../../src-renderer/archive/api';
import { NO_EVENT } from '../../../src-renderer/archive/journal/versions';
import {
  bundleFileName, conflictChoices, conflictSideWords, outcomeLines, plainSummary,
} from '../../../src-renderer/app/state/teamWords';

// Synthetic team records of the invented Harrow Flats field; the expected words are set here.
const empty: ApplyOutcome = { added: 0, duplicates: 0, conflicts: [], findings: [], issues: [], missingRawFiles: [] };

function conflict(kind: TeamConflict['kind']): TeamConflict {
  return {
    id: `${kind}:abc`, kind, testId: 't7', eventIds: ['e1', 'e2'], authors: ['Ada Brennan', 'Idris Calloway'], message: 'm', resolution: null,
    events: [
      { id: 'e1', author: 'Ada Brennan', device: '19e8ec9b-1111-4222-8333-944445555666', time: '2026-12-01T10:00:00Z', kind: 'pick-moved', summary: 'moved the closure pick of test t7, cycle 1 (G-function)' },
      { id: 'e2', author: 'Idris Calloway', device: 'laptop-2', time: '2026-12-01T10:05:00Z', kind: kind === 'concurrent-pick-moves' ? 'pick-moved' : 'signed-off', summary: 'signed off test t7 with grade B' },
    ],
  };
}

describe('bundleFileName', () => {
  it('should name the bundle after the field and the local date', () => {
    expect(bundleFileName(['Harrow Flats'], new Date(2026, 11, 1, 20, 5))).toBe('harrow-flats-2026-12-01.slbundle');
    expect(bundleFileName(['Harrow Flats', 'Second field'], new Date(2026, 0, 9))).toBe('all-fields-2026-01-09.slbundle');
    expect(bundleFileName([], new Date(2026, 0, 9))).toBe('empty-archive-2026-01-09.slbundle');
  });
});

describe('outcomeLines', () => {
  it('should say that a bundle already taken in adds nothing', () => {
    const lines = outcomeLines({ ...empty, duplicates: 41 });
    expect(lines.find((l) => l.key === 'added')?.text).toMatch(/^Nothing new/);
    expect(lines.find((l) => l.key === 'duplicates')?.text).toBe('41 changes already held here (left as they were).');
    expect(lines.find((l) => l.key === 'conflicts')?.tone).toBe('plain');
  });

  it('should count new changes and conflicts, and name journal issues and missing raw files', () => {
    const lines = outcomeLines({
      ...empty, added: 1, conflicts: [conflict('concurrent-pick-moves')],
      issues: [{ kind: 'chain-broken', message: 'the chain breaks', file: 'Ada Brennan@pc.jsonl', line: 12 }],
      missingRawFiles: [{ testId: 't9', fileHash: 'h', fileName: 'HF-2_LOT_1900m.csv' }],
    });
    expect(lines.find((l) => l.key === 'added')?.text).toBe('1 change new to this archive taken in.');
    expect(lines.find((l) => l.key === 'conflicts')).toMatchObject({ tone: 'bad', text: expect.stringMatching(/^1 conflict to decide/) });
    expect(lines.find((l) => l.key === 'issues')?.text).toBe('1 journal issue: the chain breaks (Ada Brennan@pc.jsonl, line 12).');
    expect(lines.find((l) => l.key === 'missing')?.text).toContain('HF-2_LOT_1900m.csv');
  });
});

describe('conflictChoices', () => {
  it('should offer only keeping one pick for two pick moves', () => {
    expect(conflictChoices(conflict('concurrent-pick-moves')).map((c) => c.keep)).toEqual(['e1', 'e2']);
  });

  it('should also offer voiding the sign-off when a sign-off is involved', () => {
    expect(conflictChoices(conflict('sign-off-concurrent-change')).map((c) => c.keep)).toEqual(['e1', 'e2', NO_EVENT]);
  });
});

describe('conflictSideWords', () => {
  it('should say who, on which computer, when and what', () => {
    const w = conflictSideWords(conflict('concurrent-pick-moves').events[0]);
    expect(w.who).toBe('Ada Brennan');
    expect(w.where).toBe('computer 19e8ec9b');
    expect(w.when).toMatch(/^2026-12-01 \d\d:\d\d$/);
    expect(w.what).toContain('closure pick');
  });
});

describe('plainSummary', () => {
  const label = (id: string) => (id === 't7' ? 'HF-1 XLOT at 2,600 m TVD' : null);
  it('should replace known test ids by the test and pick kinds by their names', () => {
    expect(plainSummary('moved the leakOff pick of test t7, cycle 1 (tangent)', label)).toBe('moved the leak-off point pick of HF-1 XLOT at 2,600 m TVD, cycle 1 (tangent)');
    expect(plainSummary('moved the isip pick of test t7, cycle 2 (late)', label)).toBe('moved the ISIP pick of HF-1 XLOT at 2,600 m TVD, cycle 2 (late)');
    expect(plainSummary('signed off test t7 with grade B', label)).toBe('signed off HF-1 XLOT at 2,600 m TVD with grade B');    // A comment summary puts a colon right after the id (synthetic summary, expected words set here).
    expect(plainSummary('commented on test t7: Looking at the closure picks.', label)).toBe('commented on HF-1 XLOT at 2,600 m TVD: Looking at the closure picks.');
  });

  it('should leave unknown ids and words as they are', () => {
    expect(plainSummary('rejected test t8 (noisy)', label)).toBe('rejected test t8 (noisy)');
    expect(plainSummary('changed the project limits: sampling.maxInterval (why)', label)).toBe('changed the project limits: sampling.maxInterval (why)');
  });
});
