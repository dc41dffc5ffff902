/**
 * Look-alike wire numbers: the markings a person can misread for one another at the cabinet.
 * Our own definition (common practice, no source), applied to normalised numbers (trimmed,
 * upper case, inner spaces removed):
 *  - `same`: identical numbers. Under the usual convention one wire number is one electrical
 *    node, so a hazard and an input sharing one is either a schedule error or a real joint.
 *  - `similar`: equal length ≥ 2 and exactly one of
 *      a) one character replaced by a character it is commonly misread as
 *         (1/7, 1/I, 1/L, 0/8, 3/8, 6/8, 5/6, 0/O, 0/D, 2/Z, 5/S, 8/B);
 *      b) two adjacent, different characters swapped ("1041" / "1014");
 *      c) the 180°-rotated reading of a sleeve marker: reversed, with 6↔9 and 0, 1, 8 kept
 *         ("1069" read upside down is "6901"); only numbers made of 0 1 6 8 9 rotate.
 *  Plain neighbours in a sequence ("101" / "102") are NOT look-alikes: 1 and 2 are not misread.
 */

const CONFUSABLE_PAIRS: readonly (readonly [string, string])[] = [
  ['1', '7'],
  ['1', 'I'],
  ['1', 'L'],
  ['0', '8'],
  ['3', '8'],
  ['6', '8'],
  ['5', '6'],
  ['0', 'O'],
  ['0', 'D'],
  ['2', 'Z'],
  ['5', 'S'],
  ['8', 'B'],
];

const CONFUSABLE: ReadonlyMap<string, readonly string[]> = (() => {
  const m = new Map<string, string[]>();
  for (const [a, b] of CONFUSABLE_PAIRS) {
    (m.get(a) ?? m.set(a, []).get(a)!).push(b);
    (m.get(b) ?? m.set(b, []).get(b)!).push(a);
  }
  return m;
})();

const ROTATED: Readonly<Record<string, string>> = {
  '0': '0',
  '1': '1',
  '8': '8',
  '6': '9',
  '9': '6',
};

export function normaliseWireNumber(raw: string | null | undefined): string | null {
  if (raw === null || raw === undefined) return null;
  const n = raw.trim().toUpperCase().replace(/\s+/g, '');
  return n === '' ? null : n;
}

/** The marker read upside down, or null when a character does not rotate. */
export function rotatedReading(n: string): string | null {
  let out = '';
  for (let i = n.length - 1; i >= 0; i--) {
    const r = ROTATED[n[i]!];
    if (r === undefined) return null;
    out += r;
  }
  return out;
}

/**
 * Every number that is `similar` to n (rule a, b or c), without n itself. Linear in the length
 * of n, so look-ups against an index stay O(length) per terminal.
 */
export function similarWireNumbers(n: string): string[] {
  const out = new Set<string>();
  forEachSimilarWireNumber(n, (v) => out.add(v));
  return [...out].sort();
}

/**
 * Calls `visit` with every `similar` number (possibly more than once, never with n itself).
 * The allocation-light form the mapping uses in its hot loop.
 */
export function forEachSimilarWireNumber(n: string, visit: (variant: string) => void): void {
  if (n.length < 2) return;
  for (let i = 0; i < n.length; i++) {
    const partners = CONFUSABLE.get(n[i]!);
    if (!partners) continue;
    for (const p of partners) visit(n.slice(0, i) + p + n.slice(i + 1));
  }
  for (let i = 0; i + 1 < n.length; i++) {
    if (n[i] === n[i + 1]) continue;
    visit(n.slice(0, i) + n[i + 1] + n[i] + n.slice(i + 2));
  }
  const rotated = rotatedReading(n);
  if (rotated !== null && rotated !== n) visit(rotated);
}

/** Whether two raw wire numbers look alike, and how ('same', 'similar' or null). */
export function wireNumberLikeness(
  a: string | null | undefined,
  b: string | null | undefined,
): 'same' | 'similar' | null {
  const na = normaliseWireNumber(a);
  const nb = normaliseWireNumber(b);
  if (na === null || nb === null) return null;
  if (na === nb) return 'same';
  return similarWireNumbers(na).includes(nb) ? 'similar' : null;
}
