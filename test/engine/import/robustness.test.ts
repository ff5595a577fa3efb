import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { EngineError } from '../../../src-renderer/engine/errors';
import { parseDelimitedTest } from '../../../src-renderer/engine/import/delimitedImport';
import { parseLasFile } from '../../../src-renderer/engine/import/lasImport';
import { referencePath } from '../../support/reference';

const tally = { read: 0, refused: 0 };

/** Runs a reader; anything thrown must be an EngineError (bad input is never a crash). */
function readsOrRefuses(read: () => unknown): void {
  try {
    read();
    tally.read++;
  } catch (e) {
    if (!(e instanceof EngineError)) throw e;
    tally.refused++;
  }
}

const lot = readFileSync(`${__dirname}/../../fixtures/import/hf3-lot-comma.csv`, 'utf8');
const las = readFileSync(referencePath('las-corpus', 'cwls-standard-examples', '2.0', 'sample_2.0.las'), 'utf8');

/** The text with one random edit: a character deleted, replaced or inserted. */
const mutated = (text: string) => fc.tuple(fc.nat({ max: text.length - 1 }), fc.constantFrom('', ',', ';', '\t', '\n', '"', 'x', '-', '.', ':', '~', '\u00b0', ' '), fc.constantFrom(0, 1))
  .map(([at, insert, remove]) => text.slice(0, at) + insert + text.slice(at + remove));

describe('import robustness', () => {
  it('should never crash on arbitrary bytes', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
      readsOrRefuses(() => parseDelimitedTest(bytes, 'fuzz.csv'));
      readsOrRefuses(() => parseLasFile(bytes, 'fuzz.las'));
    }), { numRuns: 500 });
  });

  it('should never crash on a contractor file or a LAS file with one random edit', () => {
    fc.assert(fc.property(mutated(lot), (text) => readsOrRefuses(() => parseDelimitedTest(new TextEncoder().encode(text), 'edit.csv'))), { numRuns: 400 });
    fc.assert(fc.property(mutated(las), (text) => readsOrRefuses(() => parseLasFile(new TextEncoder().encode(text), 'edit.las'))), { numRuns: 400 });
    // most single edits leave a readable file; some are refused with a typed error
    expect(tally.read).toBeGreaterThan(100);
    expect(tally.refused).toBeGreaterThan(0);
  });
});
