/**
 * The builder's editable copy of a guard: every figure kept as the text the user typed
 * ("4k99", "0.25W"), converted to SI numbers only when drawn or saved. Pure.
 */
import { EngParseError, formatEng, parseEng } from '@/lib/units';
import type {
  Guard,
  GuardElement,
  ProtectedInput,
  SeriesElement,
  ShuntElement,
} from '@/lib/stress/types';
import { INPUT_FIGURES, KIND_BY_NAME, type FigureSpec } from './elements';

export interface DraftElement {
  kind: GuardElement['kind'];
  id: string;
  bidirectional: boolean;
  figures: Record<string, string>;
}
export interface DraftStage {
  series: DraftElement;
  shunts: DraftElement[];
}
export interface GuardDraft {
  stages: DraftStage[];
  input: Record<string, string>;
  internalClamps: boolean;
}

/** Figures shown in SI with a prefix, keeping six significant figures so nothing is rounded away. */
export function figureText(value: unknown, spec: FigureSpec): string {
  return typeof value === 'number' && Number.isFinite(value) ? formatEng(value, spec.unit, 6) : '';
}

export function elementToDraft(element: GuardElement): DraftElement {
  const spec = KIND_BY_NAME.get(element.kind)!;
  const record = element as unknown as Record<string, unknown>;
  return {
    kind: element.kind,
    id: element.id,
    bidirectional: record.bidirectional === true,
    figures: Object.fromEntries(spec.figures.map((f) => [f.key, figureText(record[f.key], f)])),
  };
}

export function guardToDraft(guard: Guard): GuardDraft {
  const input = guard.input as unknown as Record<string, unknown>;
  return {
    stages: guard.stages.map((s) => ({
      series: elementToDraft(s.series),
      shunts: s.shunts.map(elementToDraft),
    })),
    input: Object.fromEntries(INPUT_FIGURES.map((f) => [f.key, figureText(input[f.key], f)])),
    internalClamps: guard.input.internalClamps === true,
  };
}

export function emptyDraft(): GuardDraft {
  return {
    stages: [],
    input: { positiveRail: '24V', negativeRail: '0', absMaxBeyondRail: '0.3V' },
    internalClamps: true,
  };
}

/** A fresh element of a kind with the next free id for its prefix (ids are unique in a guard). */
export function newElement(kind: GuardElement['kind'], draft: GuardDraft): DraftElement {
  const spec = KIND_BY_NAME.get(kind)!;
  const used = new Set(draft.stages.flatMap((s) => [s.series.id, ...s.shunts.map((e) => e.id)]));
  let n = 1;
  while (used.has(`${spec.prefix}${n}`)) n++;
  return {
    kind,
    id: `${spec.prefix}${n}`,
    bidirectional: false,
    figures: Object.fromEntries(spec.figures.map((f) => [f.key, ''])),
  };
}

export type DraftErrors = Record<string, string>;

/** Error key of a figure: "stages.0.series.resistance", "stages.1.shunts.0.zenerVoltage", "input.positiveRail". */
export const figurePath = (stage: number, slot: 'series' | number, key: string) =>
  slot === 'series' ? `stages.${stage}.series.${key}` : `stages.${stage}.shunts.${slot}.${key}`;

function readFigure(
  text: string | undefined,
  spec: FigureSpec,
  path: string,
  errors: DraftErrors,
): number | undefined {
  const raw = (text ?? '').trim();
  if (raw === '') {
    if (spec.required) errors[path] = `${spec.label} is required (${spec.unit}).`;
    return undefined;
  }
  try {
    return parseEng(raw, spec.unit);
  } catch (error) {
    errors[path] = error instanceof EngParseError ? error.message : `${spec.label}: not a number`;
    return undefined;
  }
}

function readElement(
  el: DraftElement,
  pathOf: (key: string) => string,
  errors: DraftErrors,
): GuardElement {
  const spec = KIND_BY_NAME.get(el.kind)!;
  const out: Record<string, unknown> = { kind: el.kind, id: el.id.trim() };
  if (!el.id.trim()) errors[pathOf('id')] = 'Each element needs an id (e.g. R1).';
  if (spec.bidirectional) out.bidirectional = el.bidirectional;
  for (const f of spec.figures) {
    const v = readFigure(el.figures[f.key], f, pathOf(f.key), errors);
    if (v !== undefined) out[f.key] = v;
  }
  return out as unknown as GuardElement;
}

/** Draft → Guard in SI, with every unreadable or missing figure named by its path. */
export function draftToGuard(draft: GuardDraft): { guard: Guard; errors: DraftErrors } {
  const errors: DraftErrors = {};
  const ids = new Map<string, string>();
  const checkId = (id: string, path: string) => {
    const other = ids.get(id);
    if (id && other)
      errors[path] = `Id ${id} is already used (${other}); ids must be unique in a guard.`;
    else ids.set(id, path);
  };
  const stages = draft.stages.map((stage, i) => {
    checkId(stage.series.id.trim(), figurePath(i, 'series', 'id'));
    const series = readElement(
      stage.series,
      (k) => figurePath(i, 'series', k),
      errors,
    ) as SeriesElement;
    const shunts = stage.shunts.map((sh, j) => {
      checkId(sh.id.trim(), figurePath(i, j, 'id'));
      return readElement(sh, (k) => figurePath(i, j, k), errors) as ShuntElement;
    });
    return { series, shunts };
  });
  const input: Record<string, unknown> = { internalClamps: draft.internalClamps };
  for (const f of INPUT_FIGURES) {
    const v = readFigure(draft.input[f.key], f, `input.${f.key}`, errors);
    if (v !== undefined) input[f.key] = v;
  }
  return { guard: { stages, input: input as unknown as ProtectedInput }, errors };
}
