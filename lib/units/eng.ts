/**
 * Engineering notation for component values, as written on schedules and datasheets:
 * `4k99` (4.99 kΩ), `10k`, `0.25W`, `100n`, `2M2`, `4R7`, `470u`, `1.5 mA`, `2.2µF`, `1e-3`.
 * A letter between digits marks the decimal point (the RKM code of IEC 60062); `R` there
 * means ×1. Lower-case `m` is milli and upper-case `M` is mega, as in SI; `meg` is accepted too.
 */

export type UnitSymbol = 'V' | 'A' | 'W' | 'Ω' | 'F' | 'J' | 'Hz' | 's' | 'A²s' | '°C';

const PREFIXES: Record<string, number> = {
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  µ: 1e-6, // U+00B5 micro sign
  μ: 1e-6, // U+03BC Greek small mu
  m: 1e-3,
  k: 1e3,
  K: 1e3,
  M: 1e6,
  meg: 1e6,
  MEG: 1e6,
  G: 1e9,
  R: 1, // RKM decimal marker for ohms: 4R7 = 4.7
};

/** Spellings of each unit we accept after the number. */
const UNIT_ALIASES: Record<string, UnitSymbol> = {
  V: 'V',
  v: 'V',
  A: 'A',
  W: 'W',
  Ω: 'Ω',
  Ω: 'Ω', // U+2126 ohm sign
  ohm: 'Ω',
  ohms: 'Ω',
  Ohm: 'Ω',
  F: 'F',
  J: 'J',
  Hz: 'Hz',
  hz: 'Hz',
  s: 's',
  'A²s': 'A²s',
  A2s: 'A²s',
  '°C': '°C',
  degC: '°C',
};

export class EngParseError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'EngParseError';
  }
}

// sign, integer digits, optional fraction, optional exponent, then the rest (prefix / RKM / unit).
const NUMBER_HEAD = /^([+-]?)(\d+(?:\.\d*)?|\.\d+)(?:[eE]([+-]?\d+))?/;
const PREFIX_ALTERNATIVES = 'meg|MEG|[pnuµμmkKMGR]';
const RKM_TAIL = new RegExp(`^(${PREFIX_ALTERNATIVES})(\\d+)`);
const PREFIX_ONLY = new RegExp(`^(${PREFIX_ALTERNATIVES})`);

/**
 * Parse a value in engineering notation into SI. Numbers pass through (must be finite).
 * `expected`, when given, is the only unit suffix accepted (a bare number is always accepted).
 * Throws EngParseError with a message fit to show the user.
 */
export function parseEng(input: string | number, expected?: UnitSymbol): number {
  if (typeof input === 'number') {
    if (!Number.isFinite(input)) throw new EngParseError(`${String(input)} is not a finite number`);
    return input;
  }
  const text = input.trim().replace(/\s+/g, ' ');
  if (text === '') throw new EngParseError('empty value');
  const head = NUMBER_HEAD.exec(text);
  if (!head) throw new EngParseError(`"${input}" does not start with a number`);
  const [whole, sign, digits, exponent] = head;
  let rest = text.slice(whole.length).replace(/^ /, '');
  let value = Number(digits) * (exponent !== undefined ? 10 ** Number(exponent) : 1);
  let multiplier = 1;

  const rkm = exponent === undefined && !digits.includes('.') ? RKM_TAIL.exec(rest) : null;
  if (rkm) {
    // 4k99 → 4.99k, 2M2 → 2.2M, 4R7 → 4.7
    value = Number(`${digits}.${rkm[2]}`);
    multiplier = PREFIXES[rkm[1]];
    rest = rest.slice(rkm[0].length).replace(/^ /, '');
  } else {
    const unitFirst = matchUnit(rest);
    // A lone "m" / "F" etc. is ambiguous only for prefixes that are also units: none of ours.
    if (unitFirst === null || unitFirst.length < rest.length) {
      const prefix = PREFIX_ONLY.exec(rest);
      if (prefix && !(prefix[1] === 'R' && rest.length > 1)) {
        multiplier = PREFIXES[prefix[1]];
        rest = rest.slice(prefix[1].length);
      }
    }
  }

  if (rest !== '') {
    const unit = UNIT_ALIASES[rest];
    if (unit === undefined) {
      throw new EngParseError(
        `"${input}": unknown unit or suffix "${rest}" (use a prefix p n u µ m k M G and a unit such as ${expected ?? 'V, A, W, Ω'})`,
      );
    }
    if (expected !== undefined && unit !== expected) {
      throw new EngParseError(`"${input}": expected a value in ${expected}, got ${unit}`);
    }
  }
  // Divide by 1e9 rather than multiply by 1e-9 so that "100n" gives exactly 1e-7.
  const scaled = multiplier < 1 ? value / Math.round(1 / multiplier) : value * multiplier;
  const result = (sign === '-' ? -1 : 1) * scaled;
  if (!Number.isFinite(result)) throw new EngParseError(`"${input}" is out of range`);
  return result;
}

function matchUnit(rest: string): string | null {
  return UNIT_ALIASES[rest] !== undefined ? rest : null;
}

const FORMAT_PREFIX_BY_EXPONENT: Record<number, string> = {
  9: 'G',
  6: 'M',
  3: 'k',
  0: '',
  [-3]: 'm',
  [-6]: 'µ',
  [-9]: 'n',
  [-12]: 'p',
};

/** 0.0167, 'A' → "16.7 mA"; 2460, 'Ω' → "2.46 kΩ". Three significant figures by default. */
export function formatEng(value: number, unit = '', significant = 3): string {
  const space = unit === '' ? '' : ' ';
  if (!Number.isFinite(value)) return `${String(value)}${space}${unit}`;
  if (value === 0) return `0${space}${unit}`;
  let exponent = Math.min(9, Math.max(-12, 3 * Math.floor(Math.log10(Math.abs(value)) / 3)));
  let scaled = roundSignificant(value / 10 ** exponent, significant);
  // Rounding can carry into the next prefix: 999.96 reads "1 k", not "1000".
  if (Math.abs(scaled) >= 1000 && exponent < 9) {
    exponent += 3;
    scaled = roundSignificant(value / 10 ** exponent, significant);
  }
  return `${String(scaled)}${space}${FORMAT_PREFIX_BY_EXPONENT[exponent]}${unit}`;
}

const POWERS_OF_TEN = [1, 10, 100, 1000, 10000, 100000];

/** x rounded to `significant` figures; Math.round instead of toPrecision (several times faster). */
function roundSignificant(x: number, significant: number): number {
  const magnitude = Math.abs(x);
  if (magnitude === 0) return 0;
  const digits = significant - 1 - Math.floor(Math.log10(magnitude));
  if (digits < 0 || digits >= POWERS_OF_TEN.length) return Number(x.toPrecision(significant));
  const scale = POWERS_OF_TEN[digits];
  return Math.round(x * scale) / scale;
}
