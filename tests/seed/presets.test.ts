import { describe, expect, it } from 'vitest';
import { guardShapeProblems } from '@/lib/presets/guard-shape';
import {
  CURRENT_LOOP_4_20_BURDEN,
  DIGITAL_24V_SINKING,
  FUSED_TERMINAL,
  INPUT_PRESETS,
  TERMINAL_BLOCK_PRESETS,
  TYPICAL_CAUTION,
  VARISTOR_SURGE_TERMINAL,
  presetRecipes,
  withTerminalBlock,
} from '@/lib/presets/guards';
import { applyGuardOverrides } from '@/lib/presets/overrides';
import type { TvsElement, VaristorElement } from '@/lib/stress/types';

const elements = (stages: typeof DIGITAL_24V_SINKING.guard.stages) =>
  stages.flatMap((s) => [s.series, ...s.shunts]);

describe('guard presets', () => {
  it('are well-formed guards, labelled typical, naming no manufacturer', () => {
    for (const p of presetRecipes()) expect(guardShapeProblems(p.guard), p.key).toEqual([]);
    for (const p of [...INPUT_PRESETS, ...TERMINAL_BLOCK_PRESETS])
      expect(p.caution).toBe(TYPICAL_CAUTION);
    expect(presetRecipes().map((p) => p.key)).toContain('tb-fused-500mA+di-24v-sinking');
  });

  it('24 V sinking input draws an IEC 61131-2 type 1 ON current at 24 V (2–15 mA, from memory)', () => {
    const series = DIGITAL_24V_SINKING.guard.stages.map((s) => s.series);
    const seriesResistance = series.reduce(
      (sum, e) => sum + ('resistance' in e && e.resistance !== undefined ? e.resistance : 0),
      0,
    );
    expect(series.map((e) => e.kind)).toContain('resistor');
    const current = 24 / (seriesResistance + DIGITAL_24V_SINKING.guard.input.inputResistance!);
    expect(current).toBeGreaterThan(0.002);
    expect(current).toBeLessThan(0.015);
  });

  it('clamps do not conduct at the highest 24 V supply (IEC 61131-2: 24 V + 20 % = 28.8 V)', () => {
    const clamps = [
      ...INPUT_PRESETS.flatMap((p) => elements(p.guard.stages)),
      ...TERMINAL_BLOCK_PRESETS.flatMap((b) => elements(b.stages)),
    ];
    const tvs = clamps.filter((e): e is TvsElement => e.kind === 'tvs');
    const movs = clamps.filter((e): e is VaristorElement => e.kind === 'varistor');
    expect(tvs.length).toBeGreaterThan(0);
    for (const d of tvs) {
      expect(d.standoffVoltage).toBeGreaterThanOrEqual(28.8);
      // TVS datasheet relations: VRWM < VBR < VC, and PPPM = VC × IPP on 10/1000 µs.
      expect(d.standoffVoltage).toBeLessThan(d.breakdownVoltage);
      expect(d.breakdownVoltage).toBeLessThan(d.clampVoltage);
      expect(d.peakPulsePower!).toBeCloseTo(d.clampVoltage * d.peakPulseCurrent, -1);
    }
    for (const v of movs) {
      expect(v.maxContinuousVoltage).toBeGreaterThanOrEqual(28.8);
      expect(v.varistorVoltage).toBeGreaterThan(v.maxContinuousVoltage);
      expect(v.clampVoltage).toBeGreaterThan(v.varistorVoltage);
    }
  });

  it('4–20 mA burden gives 5 V at 20 mA, inside the converter rail', () => {
    const burden = elements(CURRENT_LOOP_4_20_BURDEN.guard.stages).find((e) => e.id === 'RB') as {
      resistance: number;
    };
    expect(0.02 * burden.resistance).toBeCloseTo(5, 10);
    expect(0.02 * burden.resistance).toBeLessThan(
      CURRENT_LOOP_4_20_BURDEN.guard.input.positiveRail,
    );
  });

  it('fused terminal: the fuse carries a 20 mA loop with wide margin (common practice, no source)', () => {
    const fuse = FUSED_TERMINAL.stages[0]!.series as { ratedCurrent: number };
    expect(fuse.ratedCurrent).toBeGreaterThan(0.02 * 10);
  });
});

describe('guardShapeProblems', () => {
  it('names a misspelt rating instead of letting the part be judged without it', () => {
    const guard = structuredClone(DIGITAL_24V_SINKING.guard) as unknown as {
      stages: Array<{ series: Record<string, unknown> }>;
    };
    guard.stages[1]!.series.ratedpower = 0.5;
    expect(guardShapeProblems(guard)).toEqual([
      'guard.stages[1].series.ratedpower is not a field of this element.',
    ]);
  });

  it('names an unknown element kind and a missing boolean', () => {
    const problems = guardShapeProblems({
      stages: [
        {
          series: { kind: 'gdt', id: 'G1' },
          shunts: [
            {
              kind: 'tvs',
              id: 'D1',
              standoffVoltage: 33,
              breakdownVoltage: 36.7,
              clampVoltage: 53.3,
              peakPulseCurrent: 11.3,
            },
          ],
        },
      ],
      input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 },
    });
    expect(problems).toEqual([
      'guard.stages[0].series.kind must be one of: resistor, ptc, fuse, wire.',
      'guard.stages[0].shunts[0].bidirectional must be true or false.',
    ]);
  });
});

describe('withTerminalBlock', () => {
  it('puts the block on the field side and keeps the input', () => {
    const g = withTerminalBlock(VARISTOR_SURGE_TERMINAL, CURRENT_LOOP_4_20_BURDEN.guard);
    expect(g.stages.map((s) => s.series.id)).toEqual(['TB-W1', 'F1', 'R1']);
    expect(g.input).toEqual(CURRENT_LOOP_4_20_BURDEN.guard.input);
    expect(guardShapeProblems(g)).toEqual([]);
  });

  it('refuses a block whose element ids clash with the guard', () => {
    const clashing = {
      ...FUSED_TERMINAL,
      stages: [{ series: { kind: 'wire' as const, id: 'R1', resistance: 0.1 }, shunts: [] }],
    };
    expect(() => withTerminalBlock(clashing, DIGITAL_24V_SINKING.guard)).toThrow(/Element id "R1"/);
  });
});

describe('applyGuardOverrides', () => {
  it('lays the as-built figures over the recipe and leaves the recipe alone', () => {
    const recipe = DIGITAL_24V_SINKING.guard;
    const out = applyGuardOverrides(recipe, {
      elements: { R1: { resistance: 1000, ratedPower: 0.25 } },
      input: { absMaxCurrent: 0.03 },
    });
    expect(out.problems).toEqual([]);
    expect(out.guard!.stages[1]!.series).toMatchObject({
      kind: 'resistor',
      id: 'R1',
      resistance: 1000,
      ratedPower: 0.25,
      limitingVoltage: 350,
    });
    expect(out.guard!.input.absMaxCurrent).toBe(0.03);
    expect((recipe.stages[1]!.series as { resistance: number }).resistance).toBe(2200);
  });

  it('reports an unknown element and a non-numeric figure instead of dropping them', () => {
    expect(
      applyGuardOverrides(DIGITAL_24V_SINKING.guard, { elements: { R9: { resistance: 1 } } })
        .problems,
    ).toEqual(['guardOverrides.elements.R9: the recipe has no element "R9".']);
    const bad = applyGuardOverrides(DIGITAL_24V_SINKING.guard, {
      elements: { R1: { resistance: Number.NaN } },
    });
    expect(bad.guard).toBeNull();
    expect(bad.problems[0]).toMatch(/R1.resistance must be a number/);
  });
});
