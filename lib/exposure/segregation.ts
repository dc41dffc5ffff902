import { hazardCurrentKind } from './hazard';
import { buildStripLayout } from './strip-layout';
import type { CheckFinding, StripSnapshot, TerminalSnapshot } from './types';

/**
 * Voltage bands for the segregation check: extra-low voltage (`elv`) up to 50 V AC rms or
 * 120 V ripple-free DC, low voltage (`lv`) above (IEC 60449 voltage band I limits — memory).
 */
export type VoltageBand = 'elv' | 'lv';

const ELV_AC_MAX = 50; // V rms, IEC 60449 band I (memory)
const ELV_DC_MAX = 120; // V ripple-free, IEC 60449 band I (memory)

export const SEGREGATION_CLAUSE =
  'IEC 60204-1 13.1.3 (memory); NEC 300.3(C)(1) (memory); terminal-strip practice: group by voltage class with a partition plate between groups (common practice)';

/** The band a terminal belongs to, or null for earth, spare, barrier and unknown hazards. */
export function voltageBand(t: TerminalSnapshot): VoltageBand | null {
  if (t.circuitClass === 'earth' || t.circuitClass === 'spare' || t.circuitClass === 'barrier')
    return null;
  const v = t.nominalVoltage;
  if (v === null || v === undefined || !Number.isFinite(v)) {
    if (t.circuitClass !== 'hazard') return 'elv'; // signal circuits of the inputs
    if (t.hazardKind === 'mains-line' || t.hazardKind === 'mains-neutral') return 'lv';
    return null;
  }
  const kind = t.circuitClass === 'hazard' ? hazardCurrentKind(t) : (t.currentKind ?? 'dc');
  return Math.abs(v) <= (kind === 'ac' ? ELV_AC_MAX : ELV_DC_MAX) ? 'elv' : 'lv';
}

/**
 * Walks each strip in position order (levels of a block in level order) and reports every
 * boundary where the band changes with no barrier between the two terminals. Earth and spare
 * terminals neither belong to a group nor separate groups.
 */
export function checkSegregation(
  strips: readonly StripSnapshot[],
  terminals: readonly TerminalSnapshot[],
): CheckFinding[] {
  const byStrip = new Map<string, TerminalSnapshot[]>();
  for (const t of terminals) {
    const list = byStrip.get(t.stripId);
    if (list) list.push(t);
    else byStrip.set(t.stripId, [t]);
  }
  const out: CheckFinding[] = [];
  const sortedStrips = [...strips].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  for (const strip of sortedStrips) {
    const list = byStrip.get(strip.id);
    if (!list) continue;
    let last: { t: TerminalSnapshot; band: VoltageBand } | null = null;
    let barrierSince = false;
    for (const t of buildStripLayout(list).ordered) {
      if (t.circuitClass === 'barrier') {
        barrierSince = true;
        continue;
      }
      const band = voltageBand(t);
      if (band === null) continue;
      if (last && last.band !== band && !barrierSince) {
        const [lv, elv] = band === 'lv' ? [t, last.t] : [last.t, t];
        out.push({
          kind: 'segregation',
          key: `segregation|${strip.tag}|${last.t.label}|${t.label}`,
          severity: 'violation',
          stripId: strip.id,
          terminalIds: [last.t.id, t.id],
          clause: SEGREGATION_CLAUSE,
          message: `Strip ${strip.tag}: low-voltage ${lv.label} and extra-low-voltage ${elv.label} meet with no barrier between the groups`,
        });
      }
      last = { t, band };
      barrierSince = false;
    }
  }
  return out;
}
