/**
 * `npm run bench`: every benchmark registered below, one line each. A benchmark is a named
 * function returning one or more BenchFigure (scripts/bench/exposure.ts); to add one, write it
 * in scripts/bench/<name>.ts and list it in BENCHES. Pass names to run a subset:
 * `npm run bench -- stress audit`.
 */
import { benchAudit } from './bench/audit';
import { benchExposure, type BenchFigure } from './bench/exposure';
import { benchStress } from './bench/stress';

const BENCHES: { name: string; run: () => BenchFigure | BenchFigure[] | null }[] = [
  { name: 'stress', run: benchStress },
  { name: 'exposure', run: () => benchExposure() },
  { name: 'audit', run: () => benchAudit() },
];

const wanted = process.argv.slice(2).filter((a) => a !== '--');
for (const bench of BENCHES) {
  if (wanted.length > 0 && !wanted.includes(bench.name)) continue;
  const result = bench.run();
  const figures = result === null ? [] : Array.isArray(result) ? result : [result];
  for (const f of figures) {
    const goal = Number.isFinite(f.goalMs)
      ? ` (goal < ${f.goalMs} ms: ${f.medianMs <= f.goalMs || f.cpuMedianMs <= f.goalMs ? 'met' : 'NOT met'})`
      : '';
    const cpu = Number.isFinite(f.cpuMedianMs) ? `, CPU ${f.cpuMedianMs.toFixed(1)} ms` : '';
    console.log(
      `${f.name}: ${f.medianMs.toFixed(f.medianMs < 10 ? 3 : 1)} ms median wall${cpu}${goal} — ${f.detail}`,
    );
  }
}
