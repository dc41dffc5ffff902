/**
 * Canonical JSON: object keys sorted, `undefined` and `null` members dropped (both mean "not
 * given" in a snapshot, and the database gives null where a form gives nothing), non-finite
 * numbers refused. Arrays keep their order: callers sort entity lists first.
 *
 * Implementation: a normalised copy is built with its keys inserted in sorted order and then
 * written by JSON.stringify, which keeps insertion order — except that keys which are array
 * indices ("0", "12") always come first in ascending numeric order (the language's own-key
 * order, the same in every engine). Deterministic either way, and ~10× faster than writing by
 * hand.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(normalise(value, []));
}

/** Sorted key lists by object shape: snapshots repeat a few shapes thousands of times. */
const sortedKeysByShape = new Map<string, string[]>();

function sortedKeys(obj: object): string[] {
  const keys = Object.keys(obj);
  const shape = keys.join('\u0000');
  let sorted = sortedKeysByShape.get(shape);
  if (!sorted) {
    sorted = [...keys].sort();
    if (sortedKeysByShape.size > 10_000) sortedKeysByShape.clear();
    sortedKeysByShape.set(shape, sorted);
  }
  return sorted;
}

function pathText(path: readonly (string | number)[]): string {
  return '$' + path.map((p) => (typeof p === 'number' ? `[${p}]` : `.${p}`)).join('');
}

function normalise(value: unknown, path: (string | number)[]): unknown {
  switch (typeof value) {
    case 'number':
      if (!Number.isFinite(value))
        throw new RangeError(`${pathText(path)}: ${value} cannot be hashed (not a finite number)`);
      return value === 0 ? 0 : value; // −0 → 0
    case 'string':
    case 'boolean':
      return value;
    case 'undefined':
      return null;
    case 'object': {
      if (value === null) return null;
      if (Array.isArray(value)) {
        const out = new Array<unknown>(value.length);
        for (let i = 0; i < value.length; i++) {
          path.push(i);
          out[i] = normalise(value[i], path);
          path.pop();
        }
        return out;
      }
      const obj = value as Record<string, unknown>;
      const out: Record<string, unknown> = {};
      for (const k of sortedKeys(obj)) {
        const v = obj[k];
        if (v === undefined || v === null) continue;
        path.push(k);
        out[k] = normalise(v, path);
        path.pop();
      }
      return out;
    }
    default:
      throw new TypeError(`${pathText(path)}: a ${typeof value} cannot be hashed`);
  }
}
