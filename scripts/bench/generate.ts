/**
 * Generated projects for the benchmarks: an invented water-treatment works ("Harrow Fen"),
 * deterministic from a seed. Strips alternate blocks of inputs (signal + return per channel)
 * with supply and mains terminals, some behind barriers, some not; multi-level blocks,
 * multicore cables, wire numbers and comb bridges appear at realistic rates so every exposure
 * mechanism is exercised. Invented data; no real plant.
 */
import type { ProjectSnapshot } from '../../lib/audit/types';
import type { TerminalSnapshot } from '../../lib/exposure/types';
import { presetRecipes } from '../../lib/presets/guards';

/** mulberry32: small deterministic PRNG (public-domain algorithm). */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface GenerateOptions {
  channels: number;
  seed?: number;
  /** Channels per strip (each takes two positions). */
  channelsPerStrip?: number;
  stripsPerCabinet?: number;
}

export function generateProject(options: GenerateOptions): ProjectSnapshot {
  const rand = prng(options.seed ?? 20261201);
  const perStrip = options.channelsPerStrip ?? 16;
  const stripsPerCabinet = options.stripsPerCabinet ?? 12;
  const recipes = presetRecipes().map((r, i) => ({
    id: `g${i + 1}`,
    name: r.name,
    guard: r.guard,
  }));
  const s: ProjectSnapshot = {
    cabinets: [],
    strips: [],
    terminals: [],
    channels: [],
    guards: recipes,
    settings: {
      mainsSystem: '230/400V 50Hz',
      nominalVoltage: 230,
      frequency: 50,
      supplyTolerance: 0.1,
      dcSupplyMax: 28.8,
      ambientC: 40,
      surgeLevelKv: 1,
      surgeCoupling: 'signal',
      esdLevelKv: 4,
      powerDerating: 0.5,
      voltageDerating: 0.8,
      wireColourConvention: 'iec60204-1',
      faultMode: 'line-earth',
      transientPolarity: 'positive',
    },
  };
  let wire = 1000;
  let cable = 100;
  let made = 0;
  let stripNo = 0;
  const term = (
    t: Omit<TerminalSnapshot, 'label'> & { label?: string },
    stripTag: string,
  ): TerminalSnapshot => {
    const full = { label: `${stripTag}:${t.position}`, ...t } as TerminalSnapshot;
    s.terminals.push(full);
    return full;
  };
  while (made < options.channels) {
    const cabinetIndex = Math.floor(stripNo / stripsPerCabinet);
    const cabinetId = `cab${cabinetIndex}`;
    if (stripNo % stripsPerCabinet === 0)
      s.cabinets.push({ id: cabinetId, tag: `HF-RIO-${cabinetIndex + 1}` });
    const stripTag = `X${(stripNo % stripsPerCabinet) + 1}`;
    const stripId = `${cabinetId}-${stripTag}`;
    s.strips.push({ id: stripId, cabinetId, tag: stripTag });
    stripNo++;
    let pos = 1;
    const barrierFirst = rand() < 0.6;
    // Supply and mains group at the head of the strip.
    term(
      {
        id: `${stripId}-p${pos}`,
        stripId,
        position: pos,
        circuitClass: 'hazard',
        hazardKind: 'mains-line',
        nominalVoltage: 230,
        currentKind: 'ac',
        frequency: 50,
        wireColour: rand() < 0.9 ? 'BK' : 'RD',
        wireNumber: `L${wire++}`,
      },
      stripTag,
    );
    pos++;
    term(
      {
        id: `${stripId}-p${pos}`,
        stripId,
        position: pos,
        circuitClass: 'hazard',
        hazardKind: 'mains-neutral',
        nominalVoltage: 230,
        currentKind: 'ac',
        frequency: 50,
        wireColour: 'light blue',
        wireNumber: `N${wire++}`,
      },
      stripTag,
    );
    pos++;
    if (rand() < 0.7) {
      term(
        {
          id: `${stripId}-p${pos}`,
          stripId,
          position: pos,
          circuitClass: 'earth',
          wireColour: 'GNYE',
        },
        stripTag,
      );
      pos++;
    }
    if (barrierFirst) {
      term({ id: `${stripId}-p${pos}`, stripId, position: pos, circuitClass: 'barrier' }, stripTag);
      pos++;
    }
    term(
      {
        id: `${stripId}-p${pos}`,
        stripId,
        position: pos,
        circuitClass: 'hazard',
        hazardKind: 'dc-supply',
        nominalVoltage: 24,
        currentKind: 'dc',
        wireColour: 'BU',
        wireNumber: `${wire++}`,
        bridgeGroup: 'P24',
      },
      stripTag,
    );
    pos++;
    term(
      {
        id: `${stripId}-p${pos}`,
        stripId,
        position: pos,
        circuitClass: 'hazard',
        hazardKind: 'dc-supply',
        nominalVoltage: 24,
        currentKind: 'dc',
        wireColour: 'BU',
        wireNumber: `${wire++}`,
        bridgeGroup: 'P24',
      },
      stripTag,
    );
    pos++;
    const cableId = `W-${cable++}`;
    for (let k = 0; k < perStrip && made < options.channels; k++, made++) {
      const tag = `${['FT', 'PT', 'LT', 'TT', 'XS', 'ZS'][k % 6]}-${String(made + 1).padStart(5, '0')}`;
      const stacked = rand() < 0.15;
      const sig = term(
        {
          id: `${stripId}-p${pos}a`,
          stripId,
          position: pos,
          level: stacked ? 1 : null,
          blockId: stacked ? `${stripId}-K${pos}` : null,
          circuitClass: 'sensitive',
          currentKind: 'dc',
          wireColour: 'BU',
          wireNumber: `${wire++}`,
          cableId,
          cableCore: `${2 * k + 1}`,
          channelId: `ch${made}`,
        },
        stripTag,
      );
      let ret: TerminalSnapshot;
      if (stacked) {
        ret = term(
          {
            id: `${stripId}-p${pos}b`,
            stripId,
            position: pos,
            level: 2,
            blockId: `${stripId}-K${pos}`,
            label: `${stripTag}:${pos}.2`,
            circuitClass: 'return',
            currentKind: 'dc',
            wireColour: 'BU',
            wireNumber: `${wire++}`,
            cableId,
            cableCore: `${2 * k + 2}`,
            bridgeGroup: 'COM',
          },
          stripTag,
        );
        // A three-level sensor block: supply on the top level, one slip above the signal.
        if (rand() < 0.4) {
          term(
            {
              id: `${stripId}-p${pos}c`,
              stripId,
              position: pos,
              level: 3,
              blockId: `${stripId}-K${pos}`,
              label: `${stripTag}:${pos}.3`,
              circuitClass: 'hazard',
              hazardKind: 'dc-supply',
              nominalVoltage: 24,
              currentKind: 'dc',
              wireColour: 'BU',
              wireNumber: `${wire++}`,
            },
            stripTag,
          );
        }
        pos++;
      } else {
        pos++;
        ret = term(
          {
            id: `${stripId}-p${pos}`,
            stripId,
            position: pos,
            circuitClass: 'return',
            currentKind: 'dc',
            wireColour: 'BU',
            wireNumber: `${wire++}`,
            cableId,
            cableCore: `${2 * k + 2}`,
            bridgeGroup: 'COM',
          },
          stripTag,
        );
        pos++;
      }
      const recipe = rand() < 0.03 ? null : recipes[Math.floor(rand() * recipes.length)]!;
      const overrideR = recipe !== null && rand() < 0.05;
      const firstSeries = recipe?.guard.stages[0]?.series;
      s.channels.push({
        id: `ch${made}`,
        tag,
        signalType: 'current-4-20',
        signalTerminalId: sig.id,
        returnTerminalId: ret.id,
        guardRecipeId: recipe?.id ?? null,
        guardOverrides:
          overrideR &&
          firstSeries &&
          'resistance' in firstSeries &&
          firstSeries.resistance !== undefined
            ? { elements: { [firstSeries.id]: { resistance: firstSeries.resistance * 2 } } }
            : null,
      });
      // Now and then a motor output or a heater lands among the inputs (a real-world habit).
      if (rand() < 0.04) {
        term(
          {
            id: `${stripId}-p${pos}`,
            stripId,
            position: pos,
            circuitClass: 'hazard',
            hazardKind: rand() < 0.5 ? 'motor-output' : 'heater-output',
            nominalVoltage: 230,
            currentKind: 'ac',
            frequency: 50,
            wireColour: 'BK',
            wireNumber: `${wire++}`,
            cableId: rand() < 0.3 ? cableId : null,
          },
          stripTag,
        );
        pos++;
      }
    }
    term({ id: `${stripId}-p${pos}`, stripId, position: pos, circuitClass: 'spare' }, stripTag);
  }
  return s;
}

/** Terminals of generated strips until exactly `count` (for the exposure benchmark). */
export function generateTerminals(count: number, seed = 7): ProjectSnapshot {
  let channels = Math.ceil(count / 2);
  let p = generateProject({ channels, seed });
  while (p.terminals.length < count) {
    channels = Math.ceil(channels * 1.1);
    p = generateProject({ channels, seed });
  }
  const keep = new Set(p.terminals.slice(0, count).map((t) => t.id));
  p.terminals = p.terminals.filter((t) => keep.has(t.id));
  p.channels = p.channels.filter(
    (c) =>
      keep.has(c.signalTerminalId) && (c.returnTerminalId == null || keep.has(c.returnTerminalId)),
  );
  return p;
}
