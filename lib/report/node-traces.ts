/**
 * Voltages at the guard's inner nodes, for the plots. The engine's waveform carries the field
 * terminal and the protected input; between them, node k of a ladder sits one series element
 * further down: V(k) = V(k−1) − I(S_k)·R(S_k) (Ohm's law on the engine's own series currents).
 * Only through linear series elements (resistors, wires): past a PTC or fuse the drop is not a
 * fixed resistance, so no inner node is drawn beyond one.
 */
import type { Guard, Waveform, WaveformTrace } from '../stress/types';

export function innerNodeTraces(guard: Guard, waveform: Waveform): WaveformTrace[] {
  const terminal = waveform.traces.find((t) => t.name === 'terminal');
  if (!terminal || guard.stages.length < 2) return [];
  const out: WaveformTrace[] = [];
  let previous = terminal.values;
  // The last node is the protected input itself, which the engine already gives.
  for (let k = 0; k < guard.stages.length - 1; k++) {
    const series = guard.stages[k]!.series;
    if (series.kind !== 'resistor' && series.kind !== 'wire') break;
    const current = waveform.traces.find((t) => t.name === `I(${series.id})`);
    if (!current) break;
    const r = series.resistance;
    const values = previous.map((v, i) => v - current.values[i]! * r);
    out.push({ name: `node ${k + 1} (after ${series.id})`, unit: 'V', values });
    previous = values;
  }
  return out;
}

/** The same walk carried to the last node, which must land on the engine's input trace (a check). */
export function lastNodeByOhm(guard: Guard, waveform: Waveform): number[] | null {
  const terminal = waveform.traces.find((t) => t.name === 'terminal');
  if (!terminal) return null;
  let values = terminal.values;
  for (const stage of guard.stages) {
    const s = stage.series;
    if (s.kind !== 'resistor' && s.kind !== 'wire') return null;
    const current = waveform.traces.find((t) => t.name === `I(${s.id})`);
    if (!current) return null;
    values = values.map((v, i) => v - current.values[i]! * s.resistance);
  }
  return values;
}
