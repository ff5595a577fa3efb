/**
 * Canonical JSON: object keys sorted, no whitespace, `undefined` members left out. The
 * same event always gives the same bytes, so its SHA-256 is stable on every machine and
 * the journal line can be checked against the hash its successor carries.
 */

/**
 * The canonical JSON text of `value`.
 * @param value plain data (objects, arrays, strings, finite numbers, booleans, null).
 * @throws TypeError on a non-finite number, a function, a symbol or a bigint: those have no
 *   faithful JSON form and would change meaning on the way through a journal.
 * @example canonicalJson({ b: 1, a: [true, null] }) // '{"a":[true,null],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  return write(value, '$');
}

function write(value: unknown, path: string): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'string':
      return JSON.stringify(value);
    case 'boolean':
      return value ? 'true' : 'false';
    case 'number':
      if (!Number.isFinite(value)) throw new TypeError(`${path}: ${value} cannot be written to a journal (expected a finite number)`);
      return JSON.stringify(value);
    case 'object': {
      if (Array.isArray(value)) {
        let out = '[';
        for (let i = 0; i < value.length; i++) {
          if (i) out += ',';
          const item = value[i];
          out += item === undefined ? 'null' : write(item, `${path}[${i}]`);
        }
        return out + ']';
      }
      const record = value as Record<string, unknown>;
      const keys = Object.keys(record).sort();
      let out = '{';
      let first = true;
      for (const key of keys) {
        const item = record[key];
        if (item === undefined) continue;
        if (!first) out += ',';
        first = false;
        out += JSON.stringify(key) + ':' + write(item, `${path}.${key}`);
      }
      return out + '}';
    }
    default:
      throw new TypeError(`${path}: a ${typeof value} cannot be written to a journal`);
  }
}
