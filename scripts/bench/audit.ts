/** Benchmark: full audit of a generated 10 000-channel project, 4+ cases each (goal < 2 s, issue 4). */
import { pathToFileURL } from 'node:url';
import { runAudit } from '../../lib/audit';
import { timeRuns, type BenchFigure } from './exposure';
import { generateProject } from './generate';

export function benchAudit(runs = 3): BenchFigure {
  // Positive-polarity surge and ESD (the generator's setting) plus each channel's hazards.
  const snapshot = generateProject({ channels: 10_000 });
  let detail = '';
  const t = timeRuns(() => {
    const r = runAudit(snapshot);
    const s = r.summary;
    detail = `${s.channels} channels, ${snapshot.terminals.length} terminals, ${s.findings} findings (${(s.findings / s.channels).toFixed(1)} cases per channel), ${s.solverCalls} engine solutions, ${r.checks.length} checks`;
  }, runs);
  return { name: 'full audit, 10 000 channels', goalMs: 2000, ...t, runs, detail };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href)
  console.log(benchAudit());
