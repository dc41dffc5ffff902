'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { projectSettingsUpdateSchema } from '@/lib/validation/project-settings';
import {
  FAULT_MODES,
  OVERVOLTAGE_CATEGORIES,
  SURGE_COUPLINGS,
  WIRE_COLOUR_CONVENTIONS,
} from '@/models/enums';

type FormInput = z.input<typeof projectSettingsUpdateSchema>;
type FormOutput = z.output<typeof projectSettingsUpdateSchema>;

const LABELS = {
  surgeCoupling: {
    'line-earth': 'Line to earth (+10 Ω)',
    'line-line': 'Line to line (no extra)',
    signal: 'Unshielded signal line (+40 Ω)',
  },
  wireColourConvention: { 'iec60204-1': 'IEC 60204-1', nfpa79: 'NFPA 79', none: 'No colour check' },
  faultMode: {
    'line-earth': 'Line to earth (one wrong landing)',
    'line-line': 'Line to line (two wrong landings / ungrounded)',
  },
} as const;

const selectClass = 'h-10 w-full rounded-sm border border-line bg-panel px-3 text-sm text-ink';

export function SettingsForm({
  projectId,
  initial,
  canEdit,
}: {
  projectId: number;
  initial: FormOutput;
  canEdit: boolean;
}) {
  const router = useRouter();
  const [status, setStatus] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const form = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(projectSettingsUpdateSchema),
    defaultValues: initial,
  });
  const { register, handleSubmit, setError, reset, formState } = form;
  const errors = formState.errors;

  async function onSubmit(values: FormOutput) {
    setStatus(null);
    const res = await fetch(`/api/projects/${projectId}/settings`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(values),
    });
    const body = await res.json().catch(() => ({}));
    if (res.ok) {
      reset(body);
      setStatus({ kind: 'ok', text: 'Assumptions saved. Run the audit again to apply them.' });
      router.refresh();
      return;
    }
    if (res.status === 409 && body.current) {
      setStatus({
        kind: 'error',
        text: 'Someone else saved these assumptions while you were editing. Their values are now shown; your changes were not saved — re-enter them if they still apply.',
      });
      reset(body.current);
      return;
    }
    for (const [path, messages] of Object.entries(
      (body.fieldErrors ?? {}) as Record<string, string[]>,
    )) {
      setError(path as Path<FormInput>, { message: messages[0] });
    }
    setStatus({ kind: 'error', text: body.error ?? `Saving failed (${res.status}).` });
  }

  const text = (name: keyof FormInput, label: string, hint?: string, step = 'any') => (
    <Field id={name} label={label} hint={hint} error={errors[name]?.message}>
      <Input
        id={name}
        type="number"
        step={step}
        disabled={!canEdit}
        aria-invalid={!!errors[name]}
        aria-describedby={errors[name] ? `${name}-error` : undefined}
        {...register(name)}
      />
    </Field>
  );

  const select = (
    name: keyof FormInput,
    label: string,
    options: readonly string[],
    labels?: Record<string, string>,
  ) => (
    <Field id={name} label={label} error={errors[name]?.message}>
      <select id={name} className={selectClass} disabled={!canEdit} {...register(name)}>
        {options.map((o) => (
          <option key={o} value={o}>
            {labels?.[o] ?? o}
          </option>
        ))}
      </select>
    </Field>
  );

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-6">
      <input type="hidden" {...register('version')} />
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold uppercase">Supply</legend>
        <Field id="mainsSystem" label="Mains system" error={errors.mainsSystem?.message}>
          <Input
            id="mainsSystem"
            disabled={!canEdit}
            aria-invalid={!!errors.mainsSystem}
            {...register('mainsSystem')}
          />
        </Field>
        {text('nominalVoltage', 'Nominal line-to-earth voltage (V rms)')}
        {text('frequency', 'Frequency (Hz)', '50 or 60')}
        {text(
          'supplyTolerance',
          'Supply tolerance (fraction)',
          'IEC 60038: 0.10 for 230/400 V systems',
        )}
        {text('dcSupplyMax', 'DC supply maximum (V)', 'IEC 61131-2: 28.8 V for a 24 V supply')}
        {select('faultMode', 'Mis-wire fault', FAULT_MODES, LABELS.faultMode)}
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold uppercase">Transients</legend>
        {select(
          'overvoltageCategory',
          'Overvoltage category (IEC 60664-1)',
          OVERVOLTAGE_CATEGORIES,
        )}
        {text('surgeLevelKv', 'Surge level (kV, IEC 61000-4-5)', 'Levels 1–4: 0.5 / 1 / 2 / 4 kV')}
        {select('surgeCoupling', 'Surge coupling', SURGE_COUPLINGS, LABELS.surgeCoupling)}
        {text(
          'esdLevelKv',
          'ESD contact level (kV, IEC 61000-4-2)',
          'Levels 1–4: 2 / 4 / 6 / 8 kV',
        )}
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold uppercase">Derating and checks</legend>
        {text('ambientC', 'Cabinet ambient (°C)')}
        {text('powerDerating', 'Power derating (fraction of rating)', 'Common practice: 0.5–0.6')}
        {text('voltageDerating', 'Voltage derating (fraction of rating)', 'Common practice: 0.8')}
        {select(
          'wireColourConvention',
          'Wire-colour convention',
          WIRE_COLOUR_CONVENTIONS,
          LABELS.wireColourConvention,
        )}
      </fieldset>
      {status ? (
        <p
          role={status.kind === 'error' ? 'alert' : 'status'}
          className={
            status.kind === 'error'
              ? 'rounded-sm border border-danger bg-danger-soft p-2 text-sm text-danger'
              : 'rounded-sm border border-line bg-accent-soft p-2 text-sm'
          }
        >
          {status.text}
        </p>
      ) : null}
      {canEdit ? (
        <Button type="submit" disabled={formState.isSubmitting || !formState.isDirty}>
          {formState.isSubmitting ? 'Saving…' : 'Save assumptions'}
        </Button>
      ) : (
        <p className="text-sm text-muted">
          Only a controls engineer or an administrator may change the assumptions.
        </p>
      )}
    </form>
  );
}
