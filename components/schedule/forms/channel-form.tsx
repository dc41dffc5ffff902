'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useState, type FormEvent } from 'react';
import { useForm } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { FigureGrid } from '@/components/guards/guard-builder';
import { GuardSchematic } from '@/components/guards/guard-schematic';
import { INPUT_FIGURES, KIND_BY_NAME } from '@/components/guards/elements';
import { figureText } from '@/components/guards/draft';
import { applyGuardOverrides, type GuardOverrides } from '@/lib/presets/overrides';
import { EngParseError, parseEng } from '@/lib/units';
import { channelCreateSchema, type ChannelCreateInput } from '@/lib/validation/channel';
import { SIGNAL_TYPES } from '@/models/enums';
import { keys, projectApi } from '../api';
import type { ChannelRow, GuardRecipe, TerminalRow } from '../types';
import { FormFooter } from './form-footer';
import { applyServerErrors, ariaFor } from './server-errors';

const FIELDS = [
  'tag',
  'name',
  'signalType',
  'signalTerminalId',
  'returnTerminalId',
  'guardRecipeId',
  'guardOverrides',
  'notes',
] as const;
const selectClass =
  'h-10 w-full rounded-sm border border-line bg-panel px-2 text-sm text-ink aria-invalid:border-danger';
const idOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));
const textOrNull = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : v);

/** Override texts per element id (and 'input'), as typed. */
type OverrideDraft = Record<string, Record<string, string>>;

function overridesToDraft(
  o: GuardOverrides | null | undefined,
  recipe: GuardRecipe | undefined,
): OverrideDraft {
  const out: OverrideDraft = {};
  if (!o || !recipe) return out;
  const elements = recipe.guard.stages.flatMap((s) => [s.series, ...s.shunts]);
  for (const [id, figures] of Object.entries(o.elements ?? {})) {
    const spec = KIND_BY_NAME.get(elements.find((e) => e.id === id)?.kind ?? 'resistor');
    out[id] = Object.fromEntries(
      Object.entries(figures).map(([k, v]) => {
        const f = spec?.figures.find((x) => x.key === k);
        return [k, f ? figureText(v, f) : String(v)];
      }),
    );
  }
  if (o.input) {
    out.input = Object.fromEntries(
      Object.entries(o.input).map(([k, v]) => {
        const f = INPUT_FIGURES.find((x) => x.key === k);
        return [k, f ? figureText(v, f) : String(v)];
      }),
    );
  }
  return out;
}

/** Typed override texts → GuardOverrides in SI (null when nothing is overridden), or errors by "id.key". */
function draftToOverrides(draft: OverrideDraft, recipe: GuardRecipe | undefined) {
  const errors: Record<string, string> = {};
  if (!recipe) return { value: null, errors };
  const elements = recipe.guard.stages.flatMap((s) => [s.series, ...s.shunts]);
  const result: GuardOverrides = {};
  for (const [id, figures] of Object.entries(draft)) {
    const specs =
      id === 'input'
        ? INPUT_FIGURES
        : (KIND_BY_NAME.get(elements.find((e) => e.id === id)?.kind ?? 'resistor')?.figures ?? []);
    for (const [key, text] of Object.entries(figures)) {
      if (!text.trim()) continue;
      const spec = specs.find((s) => s.key === key);
      if (!spec) continue;
      try {
        const v = parseEng(text, spec.unit);
        if (id === 'input') (result.input ??= {})[key as 'positiveRail'] = v;
        else ((result.elements ??= {})[id] ??= {})[key] = v;
      } catch (error) {
        errors[`${id}.${key}`] = error instanceof EngParseError ? error.message : 'not a number';
      }
    }
  }
  return { value: result.elements || result.input ? result : null, errors };
}

/**
 * A channel: its tag and signal type, the terminals it uses, the guard recipe it reuses and
 * any as-built figures that differ from that recipe (per-channel overrides).
 */
export function ChannelForm({
  projectId,
  cabinetId,
  terminals,
  channel,
  readOnly,
  onDone,
}: {
  projectId: number;
  cabinetId: number;
  terminals: TerminalRow[];
  channel?: ChannelRow;
  readOnly: boolean;
  onDone: (saved: ChannelRow | null) => void;
}) {
  const queryClient = useQueryClient();
  const api = projectApi(projectId);
  const recipes = useQuery({
    queryKey: keys.recipes(projectId),
    queryFn: () => api.listGuardRecipes(),
  });
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<ChannelCreateInput>({
    resolver: zodResolver(channelCreateSchema),
    defaultValues: {
      cabinetId,
      tag: channel?.tag ?? '',
      name: channel?.name ?? null,
      signalType: channel?.signalType ?? 'current-4-20',
      signalTerminalId: channel?.signalTerminalId ?? null,
      returnTerminalId: channel?.returnTerminalId ?? null,
      guardRecipeId: channel?.guardRecipeId ?? null,
      guardOverrides: channel?.guardOverrides ?? null,
      notes: channel?.notes ?? null,
    },
  });
  // The recipe list arrives after the form: put the stored choice back once its option exists.
  useEffect(() => {
    if (recipes.data) setValue('guardRecipeId', channel?.guardRecipeId ?? null);
  }, [recipes.data, channel?.guardRecipeId, setValue]);
  const recipeId = watch('guardRecipeId');
  const recipe = recipes.data?.items.find((r) => r.id === recipeId);
  const [overrideDraft, setOverrideDraft] = useState<OverrideDraft | null>(null);
  // Until the recipes load, show the stored overrides once they can be read against their recipe.
  const draft = useMemo(
    () =>
      overrideDraft ??
      (recipe && recipe.id === channel?.guardRecipeId
        ? overridesToDraft(channel?.guardOverrides, recipe)
        : {}),
    [overrideDraft, recipe, channel?.guardRecipeId, channel?.guardOverrides],
  );
  const overrides = useMemo(() => draftToOverrides(draft, recipe), [draft, recipe]);
  const applied = recipe ? applyGuardOverrides(recipe.guard, overrides.value) : null;

  const sortedTerminals = useMemo(
    () =>
      [...terminals].sort(
        (a, b) =>
          Number(b.circuitClass === 'sensitive') - Number(a.circuitClass === 'sensitive') ||
          a.stripTag.localeCompare(b.stripTag) ||
          a.position - b.position,
      ),
    [terminals],
  );

  const onValid = async (values: ChannelCreateInput) => {
    setFailure(null);
    try {
      let saved: ChannelRow;
      if (channel) {
        const { cabinetId: _omit, ...rest } = values;
        const changes = Object.fromEntries(
          Object.entries(rest).filter(
            ([k, v]) =>
              JSON.stringify(channel[k as keyof ChannelRow] ?? null) !== JSON.stringify(v ?? null),
          ),
        );
        saved = await api.updateChannel(channel.id, channel.version, changes);
      } else {
        saved = await api.createChannel(values);
      }
      await queryClient.invalidateQueries({ queryKey: keys.channels(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.terminals(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.recipes(projectId) });
      onDone(saved);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  };

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    if (Object.keys(overrides.errors).length > 0) {
      event.preventDefault();
      setFailure('Some override figures cannot be read; nothing was saved.');
      return;
    }
    setValue('guardOverrides', overrides.value);
    return handleSubmit(onValid)(event);
  };

  const e = (f: (typeof FIELDS)[number]) => errors[f]?.message;
  const terminalSelect = (f: 'signalTerminalId' | 'returnTerminalId', label: string) => (
    <Field id={`c-${f}`} label={label} error={e(f)}>
      <select
        {...ariaFor(`c-${f}`, e(f))}
        disabled={readOnly}
        className={selectClass}
        {...register(f, { setValueAs: idOrNull })}
      >
        <option value="">none</option>
        {sortedTerminals.map((t) => (
          <option key={t.id} value={t.id}>
            {t.label} ({t.circuitClass})
          </option>
        ))}
      </select>
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <fieldset disabled={readOnly} className="grid min-w-0 gap-3 sm:grid-cols-3">
        <Field id="c-tag" label="Tag" hint="Unique in the project, e.g. TT-2104" error={e('tag')}>
          <Input {...ariaFor('c-tag', e('tag'))} className="font-mono" {...register('tag')} />
        </Field>
        <Field id="c-name" label="Name" error={e('name')}>
          <Input
            {...ariaFor('c-name', e('name'))}
            {...register('name', { setValueAs: textOrNull })}
          />
        </Field>
        <Field id="c-signalType" label="Signal type" error={e('signalType')}>
          <select
            {...ariaFor('c-signalType', e('signalType'))}
            className={selectClass}
            {...register('signalType')}
          >
            {SIGNAL_TYPES.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </Field>
        {terminalSelect('signalTerminalId', 'Signal terminal')}
        {terminalSelect('returnTerminalId', 'Return terminal')}
        <Field
          id="c-guardRecipeId"
          label="Guard recipe"
          hint="None = unprotected"
          error={e('guardRecipeId')}
        >
          <select
            {...ariaFor('c-guardRecipeId', e('guardRecipeId'))}
            className={selectClass}
            {...register('guardRecipeId', {
              setValueAs: idOrNull,
              onChange: () => setOverrideDraft({}),
            })}
          >
            <option value="">none</option>
            {(recipes.data?.items ?? []).map((r) => (
              <option key={r.id} value={r.id}>
                {r.name}
              </option>
            ))}
          </select>
        </Field>
      </fieldset>

      {recipe ? (
        <fieldset
          disabled={readOnly}
          className="min-w-0 space-y-3 rounded-sm border border-line p-3"
        >
          <legend className="px-1 text-sm font-medium">
            As-built overrides of “{recipe.name}” for this channel
          </legend>
          <p className="text-xs text-muted">
            Leave a figure blank to use the recipe&apos;s value (shown greyed). Overridden elements
            are drawn in the accent colour.
          </p>
          {applied?.guard ? (
            <GuardSchematic
              guard={applied.guard}
              marked={Object.keys(overrides.value?.elements ?? {})}
              title={`${recipe.name} for this channel`}
            />
          ) : (
            <p role="alert" className="text-sm text-danger">
              {applied?.problems.join(' ')}
            </p>
          )}
          {recipe.guard.stages
            .flatMap((s) => [s.series, ...s.shunts])
            .map((element) => {
              const spec = KIND_BY_NAME.get(element.kind)!;
              const record = element as unknown as Record<string, unknown>;
              return (
                <div key={element.id} className="rounded-sm border border-line p-2">
                  <p className="mb-2 text-sm">
                    <span className="font-mono font-semibold">{element.id}</span> · {spec.name}
                  </p>
                  <FigureGrid
                    specs={spec.figures}
                    values={draft[element.id] ?? {}}
                    placeholders={Object.fromEntries(
                      spec.figures.map((f) => [f.key, figureText(record[f.key], f) || 'not given']),
                    )}
                    pathOf={(k) => `${element.id}.${k}`}
                    errors={overrides.errors}
                    readOnly={readOnly}
                    onChange={(key, value) =>
                      setOverrideDraft({
                        ...draft,
                        [element.id]: { ...(draft[element.id] ?? {}), [key]: value },
                      })
                    }
                  />
                </div>
              );
            })}
          {e('guardOverrides') ? (
            <p className="text-sm text-danger">{e('guardOverrides')}</p>
          ) : null}
        </fieldset>
      ) : null}

      <Field id="c-notes" label="Notes" error={e('notes')}>
        <textarea
          {...ariaFor('c-notes', e('notes'))}
          disabled={readOnly}
          rows={2}
          className="w-full rounded-sm border border-line bg-panel p-2 text-sm"
          {...register('notes', { setValueAs: textOrNull })}
        />
      </Field>
      {readOnly ? (
        <p className="text-sm text-muted">Your role sees channels read-only.</p>
      ) : (
        <FormFooter
          failure={failure}
          submitting={isSubmitting}
          submitLabel={channel ? 'Save channel' : 'Add channel'}
          onCancel={() => onDone(null)}
        />
      )}
    </form>
  );
}
