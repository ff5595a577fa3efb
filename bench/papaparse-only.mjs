// Baseline of the analyze benchmark: read a CSV and parse it with papaparse (numbers
// converted), nothing else. Prints the row count so the work cannot be skipped.
import { readFileSync } from 'node:fs';
import process from 'node:process';
import Papa from 'papaparse';

const file = process.argv[2];
if (!file) {
  process.stderr.write('usage: node bench/papaparse-only.mjs FILE\n');
  process.exit(2);
}
const text = readFileSync(file, 'utf8');
const parsed = Papa.parse(text, { dynamicTyping: true, skipEmptyLines: true });
process.stdout.write(`${parsed.data.length} rows\n`);
