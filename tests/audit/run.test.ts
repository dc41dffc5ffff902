import { describe, expect, it } from 'vitest';
import {
  diffAudits,
  diffSnapshots,
  runAudit,
  type AuditProgress,
  type ProjectSnapshot,
} from '@/lib/audit';
import { kestrelSnapshot } from './fixtures';

// These run the real stress engine (lib/stress). Case values: IEC 60038 (253 V), IEC 61131-2
// (28.8 V), IEC 61000-4-5 / -4-2 levels; the nearest-hazard score is our own definition
// (lib/audit/score.ts).

describe('runAudit on the Kestrel Ridge strip', () => {
  const result = runAudit(kestrelSnapshot());
  const byKey = new Map(result.findings.map((f) => [f.key, f]));

  it('every channel gets surge and ESD in both polarities, exposed or not', () => {
    for (const tag of ['AI-101', 'DI-102']) {
      for (const c of ['surge+', 'surge-', 'esd+', 'esd-'])
        expect(byKey.has(`${tag}|${c}`)).toBe(true);
    }
    expect(byKey.get('AI-101|surge+')!.stress).toEqual({
      kind: 'surge',
      peakVoltage: 1000,
      couplingResistance: 40,
    });
  });

  it('the nearest mis-wire hazard is the 230 V line beside the input, not the 24 V supply farther off', () => {
    // A practitioner looking at X2: the line conductor at X2:4 is one position from the loop
    // input X2:5 — a slipped ferrule lands 253 V rms on a 100 Ω / 0.25 W resistor and it
    // burns; the 24 V supply at X2:8 is three positions from the input and two from its return,
    // a less likely slip and a smaller stress. The line terminal wins.
    const ch = result.channels.find((c) => c.tag === 'AI-101')!;
    expect(ch.nearestHazard).toMatchObject({
      hazardLabel: 'X2:4',
      mechanism: 'neighbour',
      route: 'adjacent',
      likelihood: 'likely',
      verdict: 'fails',
    });
    const top = byKey.get(ch.nearestHazard!.findingKey)!;
    expect(top.stress).toEqual({
      kind: 'ac',
      rmsVoltage: 253,
      frequency: 50,
      sourceResistance: 0.1,
    });
    expect(top.basis).toMatch(/IEC 60038/);
    // Engine figures per element are carried on the finding.
    expect(top.elements.map((e) => e.elementId)).toEqual(expect.arrayContaining(['R1', 'TVS1']));
    expect(top.margin).not.toBeNull();
    expect(top.margin!).toBeLessThan(0);
    const dc = result.findings.filter(
      (f) => f.channelTag === 'AI-101' && f.exposure?.hazardLabel === 'X2:8',
    );
    expect(dc.length).toBe(2); // the input at distance 3 and the return at distance 2
    for (const f of dc) expect(f.score!).toBeLessThan(ch.nearestHazard!.score);
  });

  it('a hazard reaching the return terminal is applied to the return', () => {
    const f = byKey.get('AI-101|dc-supply:dc|RIO-3/X2:8|neighbour:near|return')!;
    expect(f.appliedTo).toBe('return');
    expect(f.stress).toEqual({ kind: 'dc', voltage: 28.8, sourceResistance: 0.1 });
  });

  it('a channel with no guard is unprotected in every case', () => {
    const own = result.findings.filter((f) => f.channelTag === 'DI-102');
    expect(own.length).toBe(5);
    expect(new Set(own.map((f) => f.verdict))).toEqual(new Set(['unprotected']));
    expect(result.channels.find((c) => c.tag === 'DI-102')!.worstVerdict).toBe('unprotected');
  });

  it('keys are unique and the summary adds up', () => {
    expect(byKey.size).toBe(result.findings.length);
    const s = result.summary;
    expect(Object.values(s.findingsByVerdict).reduce((a, b) => a + b, 0)).toBe(
      result.findings.length,
    );
    expect(Object.values(s.channelsByVerdict).reduce((a, b) => a + b, 0)).toBe(2);
    expect(Object.values(s.findingsByMechanism).reduce((a, b) => a + b, 0)).toBe(
      result.findings.length,
    );
    expect(s.checksByKind.segregation).toBe(1); // X2:4 mains next to X2:5 with no barrier
  });

  it('a hazard with no voltage gives an incomplete finding, never a silent pass', () => {
    const s = kestrelSnapshot();
    s.terminals.push({
      id: 't10',
      stripId: 's1',
      position: 10,
      label: 'X2:10',
      circuitClass: 'hazard',
      hazardKind: 'other',
    });
    const r = runAudit(s);
    const f = r.findings.find((x) => x.exposure?.hazardLabel === 'X2:10')!;
    expect(f.verdict).toBe('incomplete');
    expect(f.reason).toMatch(/X2:10 has no nominal voltage/);
  });
});

describe('audit identity and deltas', () => {
  it('the same snapshot audited twice gives the same hash and the same findings', () => {
    const a = runAudit(kestrelSnapshot());
    const b = runAudit(kestrelSnapshot());
    expect(a.hash).toBe(b.hash);
    expect(b.findings).toEqual(a.findings);
    expect(diffAudits(a, b)).toEqual({
      inputsChanged: false,
      newFindings: [],
      resolvedFindings: [],
      changedFindings: [],
      newChecks: [],
      resolvedChecks: [],
    });
  });

  it('moving the 24 V supply one position changes the hash, and the delta names it', () => {
    const before = kestrelSnapshot();
    const after = kestrelSnapshot();
    after.terminals.find((t) => t.id === 't8')!.position = 7;
    const a = runAudit(before);
    const b = runAudit(after);
    expect(b.hash).not.toBe(a.hash);
    expect(diffSnapshots(before, after)).toEqual([
      {
        entity: 'terminal',
        id: 't8',
        label: 'X2:8',
        change: 'changed',
        fields: [{ field: 'position', before: 8, after: 7 }],
      },
    ]);
    const d = diffAudits(a, b);
    expect(d.inputsChanged).toBe(true);
    // Now beside the return (distance 1) and two from the input; three from DI-102's input.
    expect(d.newFindings.map((f) => f.key).sort()).toEqual([
      'AI-101|dc-supply:dc|RIO-3/X2:8|neighbour:adjacent|return',
      'DI-102|dc-supply:dc|RIO-3/X2:8|neighbour:near|signal',
    ]);
    expect(d.resolvedFindings.map((f) => f.key).sort()).toEqual([
      'AI-101|dc-supply:dc|RIO-3/X2:8|neighbour:near|return',
      'DI-102|dc-supply:dc|RIO-3/X2:8|neighbour:adjacent|signal',
    ]);
  });

  it('an as-built override changes margins: the delta lists the findings whose margin moved', () => {
    const before = kestrelSnapshot();
    const after = kestrelSnapshot();
    after.channels[0]!.guardOverrides = { elements: { R1: { ratedPower: 0.5 } } };
    const d = diffAudits(runAudit(before), runAudit(after));
    expect(d.newFindings).toEqual([]);
    expect(d.resolvedFindings).toEqual([]);
    const moved = d.changedFindings.map((c) => c.key);
    expect(moved).toContain('AI-101|dc-supply:dc|RIO-3/X2:8|neighbour:near|return');
    for (const c of d.changedFindings) expect(c.key.startsWith('AI-101|')).toBe(true);
  });
});

describe('progress and caching', () => {
  function manyChannels(n: number): ProjectSnapshot {
    const s = kestrelSnapshot();
    s.strips.push({ id: 's2', cabinetId: 'c1', tag: 'X9' });
    for (let i = 0; i < n; i++) {
      s.terminals.push({
        id: `a${i}`,
        stripId: 's2',
        position: i + 1,
        label: `X9:${i + 1}`,
        circuitClass: 'sensitive',
        currentKind: 'dc',
      });
      s.channels.push({
        id: `c${i}`,
        tag: `AI-2${String(i).padStart(2, '0')}`,
        signalTerminalId: `a${i}`,
        guardRecipeId: 'g1',
      });
    }
    return s;
  }

  it('solves each distinct guard × case once, however many channels share it', () => {
    const r = runAudit(manyChannels(30));
    // 31 channels on recipe g1: the 4 transients, plus AI-101's hazards — mains on its signal
    // and on its return, 24 V on its signal and on its return. The new inputs on X9 have no
    // exposure. Eight solutions in all.
    expect(r.summary.solverCalls).toBe(8);
    // A channel with no exposure still gets the project-wide surge and ESD, and no nearest hazard.
    const quiet = r.findings.filter((f) => f.channelTag === 'AI-200');
    expect(quiet.map((f) => f.caseId)).toEqual(['surge+', 'surge-', 'esd+', 'esd-']);
    expect(r.channels.find((c) => c.tag === 'AI-200')!.nearestHazard).toBeNull();
    expect(r.findings.length).toBeGreaterThan(120);
  });

  it('reports progress to the end, in order', () => {
    const seen: AuditProgress[] = [];
    runAudit(manyChannels(250), { onProgress: (p) => seen.push(p) });
    const stress = seen.filter((p) => p.phase === 'stress');
    expect(stress.at(-1)).toEqual({ phase: 'stress', done: 252, total: 252 });
    for (let i = 1; i < stress.length; i++)
      expect(stress[i]!.done).toBeGreaterThan(stress[i - 1]!.done);
    expect(seen.at(-1)!.phase).toBe('done');
  });
});
