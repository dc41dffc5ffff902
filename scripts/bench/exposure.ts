/** Benchmark: exposure mapping of 10 000 terminals (goal < 200 ms, issue 4). */
import { pathToFileURL } from 'node:url';
import { mapExposures } from '../../lib/exposure/map';
import { generateTerminals } from './generate';

export interface BenchFigure {
  name: string;
  goalMs: number;
  /** Median wall time of the timed runs (after one warm-up run). */
  medianMs: number;
  /** Median process CPU time of the timed runs: steadier than wall time on a busy machine. */
  cpuMedianMs: number;
  runs: number;
  detail: string;
}

/** Times `fn` `runs` times after one warm-up; medians of wall and CPU time. */
export function timeRuns(fn: () => void, runs: number): { medianMs: number; cpuMedianMs: number } {
  fn();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  return { medianMs: median(wall), cpuMedianMs: median(cpu) };
}

export function benchExposure(runs = 9): BenchFigure {
  const snapshot = generateTerminals(10_000);
  let exposures = 0;
  const t = timeRuns(() => {
    const map = mapExposures(snapshot);
    exposures = Object.values(map.countsByMechanism).reduce((a, b) => a + b, 0);
  }, runs);
  return {
    name: 'exposure mapping, 10 000 terminals',
    goalMs: 200,
    ...t,
    runs,
    detail: `${snapshot.terminals.length} terminals on ${snapshot.strips.length} strips, ${exposures} exposures`,
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href)
  console.log(benchExposure());
