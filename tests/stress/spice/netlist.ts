/**
 * Test code: writes an ngspice netlist for a guard and a stress case, from the same guard JSON
 * the engine solves, runs `ngspice -b`, and reduces its waveforms to the engine's figures.
 *
 * Mapping from datasheet figures to SPICE (the parameters come from lib/stress/network.ts
 * shuntBranches/inputBranches, which derive them from the datasheet figures):
 *   - junction branch (rail diode, zener, TVS, internal clamp, forward diode):
 *       a level-1 diode  .model D(IS=Is N=n RS=Rs)  behind a DC voltage source of `offset`
 *       volts (the breakdown knee; 0 for forward diodes), oriented by the branch direction and
 *       returning to the common or to a rail source;
 *   - varistor: a behavioural current source I = 1 mA · sgn(v) · |v / V1mA|^alpha;
 *   - resistors, wiring, fuses, PTCs (cold): resistors; 0 Ω: a 0 V source (ammeter only);
 *   - capacitor: C with IC = 0;
 *   - rails: DC voltage sources;
 *   - AC / DC: SIN or DC source behind the source resistance;
 *   - surge: behavioural source V = peak/k · (exp(−t/τ2) − exp(−t/τ1)) behind 2 Ω + coupling;
 *   - ESD: 150 pF with IC = V through 330 Ω, in parallel with the tip branch (lib/stress/waveforms.ts), transient with UIC.
 * Every element has a 0 V source in series so its current can be read.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { compileGuard, type CompiledNetwork } from '@/lib/stress/network';
import type { Guard, StressCase } from '@/lib/stress/types';
import {
  ESD_CAPACITANCE,
  ESD_RESISTANCE,
  ESD_TIP_CAPACITANCE,
  ESD_TIP_RESISTANCE,
  SURGE_GENERATOR_IMPEDANCE,
  SURGE_SHAPE_PEAK,
  SURGE_TAU_FRONT,
  SURGE_TAU_TAIL,
} from '@/lib/stress/waveforms';

export const NGSPICE = '/usr/bin/ngspice';

export interface SpiceFigures {
  sourcePeakCurrent: number;
  /** Per element id (series and shunts). */
  elements: Record<
    string,
    { peakCurrent: number; peakPower: number; average: number; energy: number; peakVoltage: number }
  >;
  inputMaxV: number;
  inputMinV: number;
  points: number;
}

const num = (x: number) => x.toPrecision(15);
const maxOf = (values: number[]) => values.reduce((m, x) => (x > m ? x : m), -Infinity);
const minOf = (values: number[]) => values.reduce((m, x) => (x < m ? x : m), Infinity);
const maxAbs = (values: number[]) =>
  values.reduce((m, x) => (Math.abs(x) > m ? Math.abs(x) : m), 0);

interface Plan {
  netlist: string;
  vectors: string[];
  net: CompiledNetwork;
  /** Analyse points with t ≥ from (AC: the last whole cycle). */
  from: number;
  to: number;
  steady: boolean;
  dc: boolean;
}

export function buildNetlist(
  guard: Guard,
  stressCase: StressCase,
  sign: 1 | -1 = 1,
  options: { cycles?: number; stepsPerCycle?: number; pulseEnd?: number; pulseStep?: number } = {},
): Plan {
  const net = compileGuard(guard);
  const lines: string[] = [
    '* crossfault stress test netlist',
    '.options reltol=1e-6 abstol=1e-13 vntol=1e-9 chgtol=1e-18 itl4=100',
  ];
  const vectors: string[] = ['v(t)', 'i(vsrc)'];
  lines.push(`Vrp rp 0 DC ${num(guard.input.positiveRail)}`);
  lines.push(`Vrn rn 0 DC ${num(guard.input.negativeRail)}`);
  // source
  let analysis = '';
  let from = 0;
  let to = 0;
  let steady = false;
  let dc = false;
  switch (stressCase.kind) {
    case 'dc':
      lines.push(`Vs s 0 DC ${num(sign * stressCase.voltage)}`);
      lines.push(
        stressCase.sourceResistance > 0
          ? `Rsrc s sa ${num(stressCase.sourceResistance)}`
          : 'Vsrcshort s sa 0',
      );
      analysis = '.op';
      steady = true;
      dc = true;
      break;
    case 'ac': {
      const period = 1 / stressCase.frequency;
      const cycles = options.cycles ?? 3;
      const steps = options.stepsPerCycle ?? 4000;
      lines.push(
        `Vs s 0 SIN(0 ${num(sign * stressCase.rmsVoltage * Math.SQRT2)} ${num(stressCase.frequency)})`,
      );
      lines.push(
        stressCase.sourceResistance > 0
          ? `Rsrc s sa ${num(stressCase.sourceResistance)}`
          : 'Vsrcshort s sa 0',
      );
      analysis = `.tran ${num(period / steps)} ${num(cycles * period)} 0 ${num(period / steps)}`;
      from = (cycles - 1) * period;
      to = cycles * period;
      steady = true;
      break;
    }
    case 'surge': {
      const k = (sign * stressCase.peakVoltage) / SURGE_SHAPE_PEAK;
      lines.push(
        `Bs s 0 V=${num(k)}*(exp(-time/${num(SURGE_TAU_TAIL)})-exp(-time/${num(SURGE_TAU_FRONT)}))`,
      );
      lines.push(`Rsrc s sa ${num(SURGE_GENERATOR_IMPEDANCE + stressCase.couplingResistance)}`);
      const end = options.pulseEnd ?? 8 * SURGE_TAU_TAIL;
      analysis = `.tran ${num(options.pulseStep ?? 10e-9)} ${num(end)} 0 ${num(options.pulseStep ?? 10e-9)}`;
      to = end;
      break;
    }
    case 'esd': {
      lines.push(`Cesd s 0 ${num(ESD_CAPACITANCE)} IC=${num(sign * stressCase.voltage)}`);
      lines.push(`Rsrc s sa ${num(ESD_RESISTANCE)}`);
      lines.push(`Ctip s2 0 ${num(ESD_TIP_CAPACITANCE)} IC=${num(sign * stressCase.voltage)}`);
      lines.push(`Rtip s2 sa ${num(ESD_TIP_RESISTANCE)}`);
      const end = options.pulseEnd ?? 2e-6;
      analysis = `.tran ${num(options.pulseStep ?? 50e-12)} ${num(end)} 0 ${num(options.pulseStep ?? 50e-12)} uic`;
      to = end;
      break;
    }
  }
  lines.push('Vsrc sa t 0');
  // series elements
  for (let k = 0; k < net.nodeCount; k++) {
    const a = k === 0 ? 't' : `n${k - 1}`;
    const b = `n${k}`;
    const r = net.seriesResistance[k];
    if (r > 0) {
      lines.push(`Vs${k} ${a} m${k} 0`);
      lines.push(`Rs${k} m${k} ${b} ${num(r)}`);
    } else {
      lines.push(`Vs${k} ${a} ${b} 0`);
    }
    vectors.push(`v(n${k})`, `i(vs${k})`);
  }
  // shunt branches
  const refNode = (rail: 'common' | 'positiveRail' | 'negativeRail') =>
    rail === 'common' ? '0' : rail === 'positiveRail' ? 'rp' : 'rn';
  net.branchSpecs.forEach((spec, b) => {
    const node = `n${net.branchNode[b]}`;
    const ref = refNode(spec.reference);
    switch (spec.type) {
      case 0: // linear
        lines.push(`Vb${b} ${node} x${b} 0`, `Rb${b} x${b} ${ref} ${num(1 / spec.conductance!)}`);
        break;
      case 3: // capacitor
        lines.push(`Vb${b} ${node} x${b} 0`, `Cb${b} x${b} ${ref} ${num(spec.capacitance!)} IC=0`);
        break;
      case 2: // power law
        lines.push(`Vb${b} ${node} x${b} 0`);
        lines.push(
          `Bb${b} x${b} ${ref} I=${num(spec.i1!)}*sgn(V(x${b})-V(${ref}))*pow(abs(V(x${b})-V(${ref}))/${num(spec.v1!)},${num(spec.alpha!)})`,
        );
        break;
      case 1: {
        const j = spec.junction!;
        lines.push(
          `.model DJ${b} D(IS=${num(j.saturationCurrent)} N=${num(j.emission)} RS=${num(j.seriesResistance)})`,
        );
        if (spec.direction === 1) {
          // node → offset → diode → ref ; Vb carries the branch current node→ref
          lines.push(`Vb${b} ${node} x${b} DC ${num(j.offset)}`, `Db${b} x${b} ${ref} DJ${b}`);
        } else {
          // ref → offset → diode → node ; branch current node→ref is −i(Vb)
          lines.push(`Vb${b} ${ref} x${b} DC ${num(j.offset)}`, `Db${b} x${b} ${node} DJ${b}`);
        }
        break;
      }
    }
    vectors.push(`i(vb${b})`);
  });
  lines.push(analysis);
  return { netlist: lines.join('\n'), vectors: [...new Set(vectors)], net, from, to, steady, dc };
}

function runNgspice(plan: Plan): { names: string[]; rows: number[][] } {
  const dir = mkdtempSync(join(tmpdir(), 'cf-spice-'));
  try {
    const out = join(dir, 'out.txt');
    const control = [
      '.control',
      'set wr_singlescale',
      'set wr_vecnames',
      'option numdgt=15',
      'run',
      plan.dc
        ? `print ${plan.vectors.join(' ')} > ${out}`
        : `wrdata ${out} ${plan.vectors.join(' ')}`,
      '.endc',
      '.end',
    ].join('\n');
    const file = join(dir, 'net.cir');
    writeFileSync(file, `${plan.netlist}\n${control}\n`);
    const run = spawnSync(NGSPICE, ['-b', file], { encoding: 'utf8', timeout: 120_000 });
    if (run.error) throw new Error(`ngspice could not run: ${run.error.message}`);
    let text: string;
    try {
      text = readFileSync(out, 'utf8');
    } catch {
      throw new Error(`ngspice produced no output:\n${run.stdout}\n${run.stderr}\n${plan.netlist}`);
    }
    if (plan.dc) {
      // lines "name = value"
      const values = new Map<string, number>();
      for (const line of text.split('\n')) {
        const m = /^\s*(\S+)\s*=\s*(\S+)/.exec(line);
        if (m) values.set(m[1].toLowerCase(), Number(m[2]));
      }
      const names = plan.vectors.map((v) => v.toLowerCase());
      const rowValues = names.map((n) => {
        const alt = n.replace(/^i\((.*)\)$/, '$1#branch');
        const value = values.get(n) ?? values.get(alt);
        if (value === undefined) throw new Error(`ngspice op output lacks ${n}:\n${text}`);
        return value;
      });
      return { names, rows: [[0, ...rowValues]] };
    }
    const lines = text.trim().split('\n');
    const names = lines[0]
      .trim()
      .split(/\s+/)
      .slice(1)
      .map((n) => n.toLowerCase());
    const rows = lines.slice(1).map((l) => l.trim().split(/\s+/).map(Number));
    return { names, rows };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Run ngspice on the guard and case and reduce to the engine's figures (same definitions). */
export function spiceFigures(
  guard: Guard,
  stressCase: StressCase,
  sign: 1 | -1 = 1,
  options: Parameters<typeof buildNetlist>[3] = {},
): SpiceFigures {
  const plan = buildNetlist(guard, stressCase, sign, options);
  const { names, rows } = runNgspice(plan);
  const col = (name: string) => {
    const k = names.indexOf(name);
    if (k < 0) throw new Error(`missing vector ${name} in ${names.join(',')}`);
    return k + 1;
  };
  const net = plan.net;
  const selected = plan.dc
    ? rows
    : rows.filter((r) => r[0] >= plan.from - 1e-15 && r[0] <= plan.to + 1e-15);
  const t = selected.map((r) => r[0]);
  const series = (k: number) => ({
    v: selected.map(
      (r) => (k === 0 ? r[col('v(t)')] : r[col(`v(n${k - 1})`)]) - r[col(`v(n${k})`)],
    ),
    i: selected.map((r) => r[col(`i(vs${k})`)]),
  });
  const branchCurrent = (b: number) => {
    const sgn = net.branchSpecs[b].type === 1 && net.branchSpecs[b].direction === -1 ? -1 : 1;
    return selected.map((r) => sgn * r[col(`i(vb${b})`)]);
  };
  const refV = (b: number) => {
    const ref = net.branchSpecs[b].reference;
    if (net.branchSpecs[b].type === 3) return 0;
    return ref === 'common' ? 0 : ref === 'positiveRail' ? net.positiveRail : net.negativeRail;
  };
  const integrate = (y: number[]) => {
    if (plan.dc) return y[0];
    let sum = 0;
    for (let k = 1; k < y.length; k++) sum += 0.5 * (y[k] + y[k - 1]) * (t[k] - t[k - 1]);
    return sum;
  };
  const span = plan.dc ? 1 : plan.steady ? plan.to - plan.from : 1;
  const elements: SpiceFigures['elements'] = {};
  net.elements.forEach((info, index) => {
    let v: number[];
    let i: number[];
    let p: number[];
    let peakCurrent: number;
    if (info.role === 'series') {
      const s = series(info.node);
      v = s.v;
      i = s.i;
      p = v.map((x, k) => x * i[k]);
      peakCurrent = maxAbs(i);
    } else {
      const branches = net.branchSpecs
        .map((_, b) => b)
        .filter((b) => net.branchElement[b] === index);
      const node = selected.map((r) => r[col(`v(n${info.node})`)]);
      const currents = branches.map(branchCurrent);
      i = node.map((_, k) => currents.reduce((acc, c) => acc + c[k], 0));
      p = node.map((x, k) =>
        branches.reduce((acc, b, m) => acc + currents[m][k] * (x - refV(b)), 0),
      );
      v = node.map((x) => maxAbs(branches.map((b) => x - refV(b))));
      peakCurrent = info.kind === 'railDiodes' ? maxOf(currents.map(maxAbs)) : maxAbs(i);
    }
    const energy = integrate(p);
    elements[info.id] = {
      peakCurrent,
      peakPower: maxOf(p),
      average: energy / span,
      energy,
      peakVoltage: maxAbs(v),
    };
  });
  const inputNode = selected.map((r) => r[col(`v(n${net.nodeCount - 1})`)]);
  return {
    sourcePeakCurrent: maxAbs(selected.map((r) => r[col('i(vsrc)')])),
    elements,
    inputMaxV: maxOf(inputNode),
    inputMinV: minOf(inputNode),
    points: selected.length,
  };
}
