'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useId, useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Panel, PanelTitle } from '@/components/ui/panel';
import { ApiError, keys, projectApi } from '@/components/schedule/api';
import { Modal } from '@/components/schedule/modal';
import type { GuardRecipe } from '@/components/schedule/types';
import { INPUT_PRESETS, TERMINAL_BLOCK_PRESETS, TYPICAL_CAUTION } from '@/lib/presets/guards';
import { guardRecipeCreateSchema } from '@/lib/validation/guard-recipe';
import { cn } from '@/lib/utils';
import {
  INPUT_FIGURES,
  KIND_BY_NAME,
  SERIES_KINDS,
  SHUNT_KINDS,
  type FigureSpec,
} from './elements';
import {
  draftToGuard,
  elementToDraft,
  emptyDraft,
  figurePath,
  guardToDraft,
  newElement,
  type DraftElement,
  type GuardDraft,
} from './draft';
import { GuardSchematic } from './guard-schematic';

const selectClass =
  'h-9 rounded-sm border border-line bg-panel px-2 text-sm text-ink disabled:opacity-70';

/**
 * Build a protection network stage by stage — each stage a series element and the shunt
 * elements at the node after it — then the protected input. Figures take engineering
 * notation; the schematic redraws as you type.
 */
export function GuardBuilder({
  projectId,
  recipe,
  canWrite,
}: {
  projectId: number;
  recipe?: GuardRecipe;
  canWrite: boolean;
}) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const api = projectApi(projectId);
  const [name, setName] = useState(recipe?.name ?? '');
  const [description, setDescription] = useState(recipe?.description ?? '');
  const [draft, setDraft] = useState<GuardDraft>(() =>
    recipe ? guardToDraft(recipe.guard) : emptyDraft(),
  );
  const [version, setVersion] = useState(recipe?.version ?? 0);
  const [fromPreset, setFromPreset] = useState(recipe?.isPreset ?? false);
  const [attempted, setAttempted] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [conflict, setConflict] = useState<GuardRecipe | null>(null);
  const readOnly = !canWrite;

  const { guard, errors } = useMemo(() => draftToGuard(draft), [draft]);
  // Missing required figures are shown once a save was tried; unreadable text at once.
  const shownErrors = useMemo(
    () =>
      attempted
        ? errors
        : Object.fromEntries(Object.entries(errors).filter(([, m]) => !m.includes('required'))),
    [errors, attempted],
  );
  const nameError = attempted && !name.trim() ? 'Name is required.' : undefined;

  const update = (fn: (d: GuardDraft) => GuardDraft) => setDraft((d) => fn(structuredClone(d)));

  const applyPreset = (key: string) => {
    const preset = INPUT_PRESETS.find((p) => p.key === key);
    if (!preset) return;
    setDraft(guardToDraft(preset.guard));
    if (!name.trim()) setName(preset.name);
    if (!description.trim()) setDescription(preset.description);
    setFromPreset(true);
  };

  const addTerminalBlock = (key: string) => {
    const block = TERMINAL_BLOCK_PRESETS.find((p) => p.key === key);
    if (!block) return;
    update((d) => {
      const stages = block.stages.map((s) => ({
        series: elementToDraft(s.series),
        shunts: s.shunts.map(elementToDraft),
      }));
      // Keep ids unique: rename a block element whose id the guard already uses.
      const taken = new Set(d.stages.flatMap((s) => [s.series.id, ...s.shunts.map((e) => e.id)]));
      for (const el of stages.flatMap((s) => [s.series, ...s.shunts])) {
        let id = el.id;
        let n = 2;
        while (taken.has(id)) id = `${el.id}_${n++}`;
        el.id = id;
        taken.add(id);
      }
      return { ...d, stages: [...stages, ...d.stages] };
    });
    setFromPreset(true);
  };

  const save = async (baseVersion = version) => {
    setAttempted(true);
    setFailure(null);
    setNotice(null);
    if (Object.keys(errors).length > 0 || !name.trim()) {
      setFailure(
        `${Object.keys(errors).length + (name.trim() ? 0 : 1)} field(s) need attention; nothing was saved.`,
      );
      return;
    }
    const body = { name: name.trim(), description: description.trim() || null, guard };
    const check = guardRecipeCreateSchema.safeParse(body);
    if (!check.success) {
      setFailure(check.error.issues.map((i) => i.message).join(' '));
      return;
    }
    setSaving(true);
    try {
      if (recipe) {
        const saved = await api.updateGuardRecipe(recipe.id, baseVersion, body);
        setVersion(saved.version);
        setNotice(`Saved (version ${saved.version}).`);
        router.refresh();
      } else {
        const saved = await api.createGuardRecipe(body);
        void queryClient.invalidateQueries({ queryKey: keys.recipes(projectId) });
        router.replace(`/projects/${projectId}/guards/${saved.id}`);
        return;
      }
      void queryClient.invalidateQueries({ queryKey: keys.recipes(projectId) });
    } catch (error) {
      if (error instanceof ApiError && error.status === 409 && error.current) {
        setConflict(error.current as GuardRecipe);
      } else if (error instanceof ApiError) {
        const listed = Object.entries(error.fieldErrors).flatMap(([k, m]) =>
          m.map((x) => (k === 'guard' || k === '_' ? x : `${k}: ${x}`)),
        );
        setFailure(`Not saved: ${listed.length ? listed.join(' ') : error.message}`);
      } else {
        setFailure(`Not saved: ${String(error)}`);
      }
    } finally {
      setSaving(false);
    }
  };

  const remove = async () => {
    if (!recipe || !window.confirm(`Delete the recipe “${recipe.name}”?`)) return;
    try {
      await api.deleteGuardRecipe(recipe.id, version);
      void queryClient.invalidateQueries({ queryKey: keys.recipes(projectId) });
      router.replace(`/projects/${projectId}/guards`);
    } catch (error) {
      setFailure(error instanceof Error ? error.message : String(error));
    }
  };

  return (
    <div className="space-y-6">
      <Panel>
        <PanelTitle
          aside={<span className="text-xs text-muted">field terminal → protected input</span>}
        >
          Schematic
        </PanelTitle>
        <GuardSchematic guard={guard} title={name || 'New guard'} />
        {fromPreset ? (
          <p className="mt-2 text-sm text-caution" data-testid="typical-caution">
            Figures from a preset are {TYPICAL_CAUTION}.
          </p>
        ) : null}
      </Panel>

      <Panel>
        <PanelTitle>Recipe</PanelTitle>
        <div className="grid gap-3 md:grid-cols-2">
          <div className="space-y-1">
            <label htmlFor="recipe-name" className="block text-sm font-medium">
              Name
            </label>
            <input
              id="recipe-name"
              value={name}
              disabled={readOnly}
              onChange={(e) => setName(e.target.value)}
              aria-invalid={nameError ? true : undefined}
              aria-describedby={nameError ? 'recipe-name-error' : undefined}
              className="h-10 w-full rounded-sm border border-line bg-panel px-3 text-sm aria-invalid:border-danger"
            />
            {nameError ? (
              <p id="recipe-name-error" className="text-sm text-danger">
                {nameError}
              </p>
            ) : null}
          </div>
          <div className="space-y-1">
            <label htmlFor="recipe-description" className="block text-sm font-medium">
              Description
            </label>
            <input
              id="recipe-description"
              value={description}
              disabled={readOnly}
              onChange={(e) => setDescription(e.target.value)}
              className="h-10 w-full rounded-sm border border-line bg-panel px-3 text-sm"
            />
          </div>
        </div>
        {canWrite ? (
          <div className="mt-4 flex flex-wrap items-end gap-3 rounded-sm border border-dashed border-line p-3">
            <label className="flex flex-col text-xs text-muted">
              Start from a preset
              <select
                className={selectClass}
                value=""
                onChange={(e) => applyPreset(e.target.value)}
              >
                <option value="">choose…</option>
                {INPUT_PRESETS.map((p) => (
                  <option key={p.key} value={p.key}>
                    {p.name}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col text-xs text-muted">
              Put a protection terminal block in front
              <select
                className={selectClass}
                value=""
                onChange={(e) => addTerminalBlock(e.target.value)}
              >
                <option value="">choose…</option>
                {TERMINAL_BLOCK_PRESETS.map((p) => (
                  <option key={p.key} value={p.key}>
                    {p.name}
                  </option>
                ))}
              </select>
            </label>
            <p className="text-xs text-caution">Preset figures are {TYPICAL_CAUTION}.</p>
          </div>
        ) : null}
      </Panel>

      <ol className="space-y-4" aria-label="Stages">
        {draft.stages.map((stage, i) => (
          <li key={i}>
            <Panel>
              <PanelTitle
                aside={
                  canWrite ? (
                    <span className="flex gap-1">
                      <Button
                        size="sm"
                        variant="ghost"
                        disabled={i === 0}
                        onClick={() => update((d) => swap(d, i, i - 1))}
                        aria-label={`Move stage ${i + 1} towards the field`}
                      >
                        ↑
                      </Button>
                      <Button
                        size="sm"
                        variant="ghost"
                        disabled={i === draft.stages.length - 1}
                        onClick={() => update((d) => swap(d, i, i + 1))}
                        aria-label={`Move stage ${i + 1} towards the input`}
                      >
                        ↓
                      </Button>
                      <Button
                        size="sm"
                        variant="ghost"
                        onClick={() =>
                          update((d) => ({ ...d, stages: d.stages.filter((_, k) => k !== i) }))
                        }
                      >
                        Remove stage
                      </Button>
                    </span>
                  ) : null
                }
              >
                Stage {i + 1}
              </PanelTitle>
              <div className="space-y-4">
                <ElementEditor
                  role="Series element"
                  element={stage.series}
                  kinds={SERIES_KINDS.map((k) => k.kind)}
                  pathOf={(k) => figurePath(i, 'series', k)}
                  errors={shownErrors}
                  readOnly={readOnly}
                  onKind={(kind) => update((d) => ((d.stages[i].series = newElement(kind, d)), d))}
                  onChange={(el) => update((d) => ((d.stages[i].series = el), d))}
                />
                {stage.shunts.map((shunt, j) => (
                  <ElementEditor
                    key={j}
                    role={`Shunt ${j + 1} at the node after ${stage.series.id}`}
                    element={shunt}
                    kinds={SHUNT_KINDS.map((k) => k.kind)}
                    pathOf={(k) => figurePath(i, j, k)}
                    errors={shownErrors}
                    readOnly={readOnly}
                    onKind={(kind) =>
                      update((d) => ((d.stages[i].shunts[j] = newElement(kind, d)), d))
                    }
                    onChange={(el) => update((d) => ((d.stages[i].shunts[j] = el), d))}
                    onRemove={() =>
                      update(
                        (d) => (
                          (d.stages[i].shunts = d.stages[i].shunts.filter((_, k) => k !== j)),
                          d
                        ),
                      )
                    }
                  />
                ))}
                {canWrite ? (
                  <label className="flex items-center gap-2 text-sm">
                    Add a shunt element:
                    <select
                      className={selectClass}
                      value=""
                      onChange={(e) =>
                        e.target.value &&
                        update(
                          (d) => (
                            d.stages[i].shunts.push(
                              newElement(e.target.value as DraftElement['kind'], d),
                            ),
                            d
                          ),
                        )
                      }
                    >
                      <option value="">choose…</option>
                      {SHUNT_KINDS.map((k) => (
                        <option key={k.kind} value={k.kind}>
                          {k.name}
                        </option>
                      ))}
                    </select>
                  </label>
                ) : null}
              </div>
            </Panel>
          </li>
        ))}
      </ol>
      {canWrite ? (
        <label className="flex items-center gap-2 text-sm">
          Add a stage starting with:
          <select
            className={selectClass}
            value=""
            onChange={(e) =>
              e.target.value &&
              update((d) => ({
                ...d,
                stages: [
                  ...d.stages,
                  { series: newElement(e.target.value as DraftElement['kind'], d), shunts: [] },
                ],
              }))
            }
          >
            <option value="">choose…</option>
            {SERIES_KINDS.map((k) => (
              <option key={k.kind} value={k.kind}>
                {k.name}
              </option>
            ))}
          </select>
        </label>
      ) : null}

      <Panel>
        <PanelTitle>Protected input</PanelTitle>
        <FigureGrid
          specs={INPUT_FIGURES}
          values={draft.input}
          pathOf={(k) => `input.${k}`}
          errors={shownErrors}
          readOnly={readOnly}
          onChange={(key, value) => update((d) => ((d.input[key] = value), d))}
        />
        <label className="mt-3 flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={draft.internalClamps}
            disabled={readOnly}
            onChange={(e) => update((d) => ({ ...d, internalClamps: e.target.checked }))}
          />
          The input has its own clamp diodes to the rails (most ICs do)
        </label>
      </Panel>

      {failure ? (
        <p
          role="alert"
          className="rounded-sm border border-danger bg-danger-soft p-2 text-sm text-danger"
        >
          {failure}
        </p>
      ) : null}
      {notice ? (
        <p role="status" className="rounded-sm border border-line bg-paper p-2 text-sm">
          {notice}
        </p>
      ) : null}
      {canWrite ? (
        <div className="flex flex-wrap justify-end gap-2">
          {recipe ? (
            <Button variant="danger" onClick={() => void remove()}>
              Delete recipe
            </Button>
          ) : null}
          <Button onClick={() => void save()} disabled={saving}>
            {saving ? 'Saving…' : recipe ? 'Save recipe' : 'Create recipe'}
          </Button>
        </div>
      ) : (
        <p className="text-sm text-muted">Your role sees guard recipes read-only.</p>
      )}

      <Modal
        open={conflict !== null}
        title="Someone else saved this recipe first"
        onClose={() => undefined}
        dismissable={false}
      >
        {conflict ? (
          <div className="space-y-3 text-sm">
            <p role="alert">
              “{conflict.name}” is now at version {conflict.version} (you started from version{' '}
              {version}). Your edits are still here and not saved.
            </p>
            <GuardSchematic guard={conflict.guard} title="Their version" />
            <div className="flex justify-end gap-2">
              <Button
                variant="secondary"
                onClick={() => {
                  setDraft(guardToDraft(conflict.guard));
                  setName(conflict.name);
                  setDescription(conflict.description ?? '');
                  setVersion(conflict.version);
                  setConflict(null);
                }}
              >
                Reload theirs
              </Button>
              <Button
                onClick={() => {
                  const v = conflict.version;
                  setVersion(v);
                  setConflict(null);
                  void save(v);
                }}
              >
                Keep mine and save again
              </Button>
            </div>
          </div>
        ) : null}
      </Modal>
    </div>
  );
}

function swap(d: GuardDraft, a: number, b: number): GuardDraft {
  const stages = [...d.stages];
  [stages[a], stages[b]] = [stages[b], stages[a]];
  return { ...d, stages };
}

function ElementEditor({
  role,
  element,
  kinds,
  pathOf,
  errors,
  readOnly,
  onKind,
  onChange,
  onRemove,
}: {
  role: string;
  element: DraftElement;
  kinds: DraftElement['kind'][];
  pathOf: (key: string) => string;
  errors: Record<string, string>;
  readOnly: boolean;
  onKind: (kind: DraftElement['kind']) => void;
  onChange: (el: DraftElement) => void;
  onRemove?: () => void;
}) {
  const spec = KIND_BY_NAME.get(element.kind)!;
  const idError = errors[pathOf('id')];
  const uid = useId();
  return (
    <fieldset className="min-w-0 rounded-sm border border-line p-3">
      <legend className="px-1 text-sm font-medium">{role}</legend>
      <div className="mb-2 flex flex-wrap items-end gap-3">
        <label className="flex flex-col text-xs text-muted">
          Kind
          <select
            className={selectClass}
            value={element.kind}
            disabled={readOnly}
            onChange={(e) => onKind(e.target.value as DraftElement['kind'])}
          >
            {kinds.map((k) => (
              <option key={k} value={k}>
                {KIND_BY_NAME.get(k)!.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-xs text-muted" htmlFor={`${uid}-id`}>
          Id
          <input
            id={`${uid}-id`}
            value={element.id}
            disabled={readOnly}
            onChange={(e) => onChange({ ...element, id: e.target.value })}
            aria-invalid={idError ? true : undefined}
            aria-describedby={idError ? `${uid}-id-error` : undefined}
            className="h-9 w-24 rounded-sm border border-line bg-panel px-2 font-mono text-sm text-ink aria-invalid:border-danger"
          />
        </label>
        {spec.bidirectional ? (
          <label className="flex h-9 items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={element.bidirectional}
              disabled={readOnly}
              onChange={(e) => onChange({ ...element, bidirectional: e.target.checked })}
            />
            both polarities (back-to-back)
          </label>
        ) : null}
        {onRemove && !readOnly ? (
          <Button size="sm" variant="ghost" className="ml-auto" onClick={onRemove}>
            Remove
          </Button>
        ) : null}
      </div>
      {idError ? (
        <p id={`${uid}-id-error`} className="mb-2 text-sm text-danger">
          {idError}
        </p>
      ) : null}
      <FigureGrid
        specs={spec.figures}
        values={element.figures}
        pathOf={pathOf}
        errors={errors}
        readOnly={readOnly}
        onChange={(key, value) =>
          onChange({ ...element, figures: { ...element.figures, [key]: value } })
        }
      />
    </fieldset>
  );
}

export function FigureGrid({
  specs,
  values,
  pathOf,
  errors,
  readOnly,
  onChange,
  placeholders,
}: {
  specs: FigureSpec[];
  values: Record<string, string>;
  pathOf: (key: string) => string;
  errors: Record<string, string>;
  readOnly: boolean;
  onChange: (key: string, value: string) => void;
  placeholders?: Record<string, string>;
}) {
  const uid = useId();
  return (
    <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      {specs.map((f) => {
        const id = `${uid}-${f.key}`;
        const error = errors[pathOf(f.key)];
        return (
          <div key={f.key} className="space-y-1">
            <label htmlFor={id} className="flex items-baseline justify-between gap-2 text-sm">
              <span>
                {f.label}
                {f.required ? <span className="text-danger"> *</span> : null}
              </span>
              <span className="font-mono text-xs text-muted">{f.unit}</span>
            </label>
            <input
              id={id}
              value={values[f.key] ?? ''}
              disabled={readOnly}
              inputMode="decimal"
              placeholder={
                placeholders?.[f.key] ?? (readOnly ? 'not given' : f.hint.replace(/^e\.g\. /, ''))
              }
              onChange={(e) => onChange(f.key, e.target.value)}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? `${id}-error` : `${id}-hint`}
              className={cn(
                'h-9 w-full rounded-sm border border-line bg-panel px-2 font-mono text-sm text-ink placeholder:text-muted/70 aria-invalid:border-danger',
              )}
            />
            {error ? (
              <p id={`${id}-error`} className="text-xs text-danger">
                {error}
              </p>
            ) : (
              <p id={`${id}-hint`} className="text-xs text-muted">
                {f.hint}
              </p>
            )}
          </div>
        );
      })}
    </div>
  );
}
