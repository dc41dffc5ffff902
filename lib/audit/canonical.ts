/**
 * Canonical JSON: object keys sorted, `undefined` and `null` members dropped (both mean "not
 * given" in a snapshot, and the database gives null where a form gives nothing), −0 written
 * as 0, non-finite numbers refused. Arrays keep their order: callers sort entity lists first.
 */
export function canonicalJson(value: unknown): string {
  return write(value, '$');
}

function write(value: unknown, path: string): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value)) throw new RangeError(`${path}: ${value} cannot be hashed (not a finite number)`);
      return JSON.stringify(Object.is(value, -0) ? 0 : value);
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'object': {
      if (Array.isArray(value)) return `[${value.map((v, i) => (v === undefined ? 'null' : write(v, `${path}[${i}]`))).join(',')}]`;
      const obj = value as Record<string, unknown>;
      const keys = Object.keys(obj).filter((k) => obj[k] !== undefined && obj[k] !== null).sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${write(obj[k], `${path}.${k}`)}`).join(',')}}`;
    }
    default:
      throw new TypeError(`${path}: a ${typeof value} cannot be hashed`);
  }
}
