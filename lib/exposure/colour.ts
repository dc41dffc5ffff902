import type {
  CheckFinding,
  CheckSeverity,
  StripSnapshot,
  TerminalSnapshot,
  WireColourConvention,
} from './types';

/** Canonical colours the check understands. Two-part names are insulation with a stripe. */
export type WireColour =
  | 'black'
  | 'brown'
  | 'red'
  | 'orange'
  | 'yellow'
  | 'green'
  | 'blue'
  | 'light-blue'
  | 'violet'
  | 'grey'
  | 'white'
  | 'pink'
  | 'turquoise'
  | 'green-yellow'
  | 'white-blue'
  | 'white-orange';

/** Words and IEC 60757 letter codes (memory) for each single colour. */
const WORDS: Readonly<Record<string, WireColour>> = {
  black: 'black',
  bk: 'black',
  brown: 'brown',
  bn: 'brown',
  red: 'red',
  rd: 'red',
  orange: 'orange',
  og: 'orange',
  yellow: 'yellow',
  ye: 'yellow',
  green: 'green',
  gn: 'green',
  blue: 'blue',
  bu: 'blue',
  lightblue: 'light-blue',
  lbu: 'light-blue',
  violet: 'violet',
  vt: 'violet',
  purple: 'violet',
  grey: 'grey',
  gray: 'grey',
  gy: 'grey',
  white: 'white',
  wh: 'white',
  pink: 'pink',
  pk: 'pink',
  turquoise: 'turquoise',
  tq: 'turquoise',
  gnye: 'green-yellow',
};

const PAIRS: Readonly<Record<string, WireColour>> = {
  'green+yellow': 'green-yellow',
  'yellow+green': 'green-yellow',
  'white+blue': 'white-blue',
  'white+orange': 'white-orange',
  'light+blue': 'light-blue',
};

/** Parses "GNYE", "GN/YE", "green-yellow", "light blue", "WH/BU" …; null when not understood. */
export function parseWireColour(raw: string): WireColour | null {
  const s = raw.trim().toLowerCase();
  if (s === '') return null;
  const whole = WORDS[s.replace(/[\s_/+-]+/g, '')];
  if (whole) return whole;
  const parts = s.split(/[\s_/+-]+/).filter(Boolean);
  if (parts.length !== 2) return null;
  const [a, b] = parts as [string, string];
  if (a === 'light' && (b === 'blue' || b === 'bu')) return 'light-blue';
  const ca = WORDS[a];
  const cb = WORDS[b];
  if (!ca || !cb) return null;
  return PAIRS[`${ca}+${cb}`] ?? null;
}

export interface ColourRule {
  /** Colours the rule accepts. */
  allowed: readonly WireColour[];
  clause: string;
  severity: CheckSeverity;
  /** What the circuit is, in the rule's words. */
  circuit: string;
}

const IEC = 'IEC 60204-1';
const NFPA = 'NFPA 79 (13.2.x or 14.2.x by edition ⚠)';

/** The rule for one terminal under a convention, or null when the convention says nothing. */
export function colourRuleFor(
  t: TerminalSnapshot,
  convention: WireColourConvention,
): ColourRule | null {
  if (convention === 'none') return null;
  const ac = t.currentKind === 'ac';
  const iec = convention === 'iec60204-1';
  if (t.circuitClass === 'earth') {
    return iec
      ? {
          allowed: ['green-yellow'],
          clause: `${IEC} 13.2.2`,
          severity: 'violation',
          circuit: 'protective conductor',
        }
      : {
          allowed: ['green', 'green-yellow'],
          clause: NFPA,
          severity: 'violation',
          circuit: 'equipment grounding conductor',
        };
  }
  if (t.circuitClass === 'hazard') {
    switch (t.hazardKind) {
      case 'mains-line':
      case 'motor-output':
      case 'heater-output':
        return iec
          ? {
              allowed: ['black'],
              clause: `${IEC} 13.2.4 (recommended)`,
              severity: 'advisory',
              circuit: 'AC/DC power circuit',
            }
          : {
              allowed: ['black'],
              clause: NFPA,
              severity: 'violation',
              circuit: 'ungrounded power conductor',
            };
      case 'mains-neutral':
        return iec
          ? {
              allowed: ['light-blue', 'blue'],
              clause: `${IEC} 13.2.3 (light blue recommended)`,
              severity: 'advisory',
              circuit: 'neutral conductor',
            }
          : {
              allowed: ['white', 'grey'],
              clause: NFPA,
              severity: 'violation',
              circuit: 'grounded AC conductor',
            };
      case 'dc-supply':
        return iec
          ? {
              allowed: ['blue'],
              clause: `${IEC} 13.2.4 (recommended)`,
              severity: 'advisory',
              circuit: 'DC control circuit',
            }
          : {
              allowed: ['blue'],
              clause: NFPA,
              severity: 'violation',
              circuit: 'ungrounded DC control conductor',
            };
      default:
        return null;
    }
  }
  if (t.circuitClass === 'sensitive') {
    return iec
      ? {
          allowed: [ac ? 'red' : 'blue'],
          clause: `${IEC} 13.2.4 (recommended)`,
          severity: 'advisory',
          circuit: ac ? 'AC control circuit' : 'DC control circuit',
        }
      : {
          allowed: [ac ? 'red' : 'blue'],
          clause: NFPA,
          severity: 'violation',
          circuit: ac ? 'ungrounded AC control conductor' : 'ungrounded DC control conductor',
        };
  }
  if (t.circuitClass === 'return') {
    if (iec) {
      return {
        allowed: [ac ? 'red' : 'blue'],
        clause: `${IEC} 13.2.4 (recommended)`,
        severity: 'advisory',
        circuit: ac ? 'AC control circuit' : 'DC control circuit',
      };
    }
    // Grounded when the common is earthed (the usual case), ungrounded otherwise: accept both.
    return ac
      ? {
          allowed: ['white', 'grey', 'red'],
          clause: NFPA,
          severity: 'violation',
          circuit: 'AC control return',
        }
      : {
          allowed: ['white-blue', 'blue'],
          clause: NFPA,
          severity: 'violation',
          circuit: 'DC control return',
        };
  }
  return null;
}

/** Green-and-yellow (IEC) or green / green-and-yellow (NFPA) on anything but earth. */
function reservedColourMisuse(
  t: TerminalSnapshot,
  colour: WireColour,
  convention: WireColourConvention,
): ColourRule | null {
  if (t.circuitClass === 'earth' || t.circuitClass === 'spare' || t.circuitClass === 'barrier')
    return null;
  if (convention === 'iec60204-1' && colour === 'green-yellow') {
    return {
      allowed: [],
      clause: `${IEC} 13.2.2`,
      severity: 'violation',
      circuit: 'protective conductor only',
    };
  }
  if (convention === 'nfpa79' && (colour === 'green' || colour === 'green-yellow')) {
    return {
      allowed: [],
      clause: NFPA,
      severity: 'violation',
      circuit: 'equipment grounding conductor only',
    };
  }
  return null;
}

/** One finding per terminal whose colour breaks a rule; terminals with no colour are skipped. */
export function checkWireColours(
  strips: readonly StripSnapshot[],
  terminals: readonly TerminalSnapshot[],
  convention: WireColourConvention,
): CheckFinding[] {
  if (convention === 'none') return [];
  const stripName = new Map(strips.map((s) => [s.id, s.tag]));
  const out: CheckFinding[] = [];
  const sorted = [...terminals].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  for (const t of sorted) {
    if (t.wireColour === null || t.wireColour === undefined || t.wireColour.trim() === '') continue;
    const strip = stripName.get(t.stripId) ?? t.stripId;
    const key = `colour|${strip}|${t.label}`;
    const colour = parseWireColour(t.wireColour);
    if (colour === null) {
      out.push({
        kind: 'colour',
        key,
        severity: 'advisory',
        stripId: t.stripId,
        terminalIds: [t.id],
        clause: 'IEC 60757 colour codes (memory)',
        message: `${t.label}: wire colour "${t.wireColour}" is not a colour the check understands`,
      });
      continue;
    }
    const reserved = reservedColourMisuse(t, colour, convention);
    if (reserved) {
      out.push({
        kind: 'colour',
        key,
        severity: reserved.severity,
        stripId: t.stripId,
        terminalIds: [t.id],
        clause: reserved.clause,
        message: `${t.label} (${t.circuitClass}) is ${colour}: that colour is reserved for the ${reserved.circuit}`,
      });
      continue;
    }
    const rule = colourRuleFor(t, convention);
    if (!rule || rule.allowed.includes(colour)) continue;
    out.push({
      kind: 'colour',
      key,
      severity: rule.severity,
      stripId: t.stripId,
      terminalIds: [t.id],
      clause: rule.clause,
      message: `${t.label} (${rule.circuit}) is ${colour}; ${rule.clause} calls for ${rule.allowed.join(' or ')}`,
    });
  }
  return out;
}
