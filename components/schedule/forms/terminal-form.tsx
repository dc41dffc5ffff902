'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { parseEng, type UnitSymbol } from '@/lib/units';
import { terminalCreateSchema, type TerminalCreateInput } from '@/lib/validation/terminal';
import { CIRCUIT_CLASSES, CURRENT_KINDS, HAZARD_KINDS } from '@/models/enums';
import { keys, projectApi } from '../api';
import type { ChannelRow, Strip, TerminalFields, TerminalRow } from '../types';
import { FormFooter } from './form-footer';
import { applyServerErrors, ariaFor } from './server-errors';

const FIELDS = [
  'stripId',
  'position',
  'level',
  'blockId',
  'label',
  'terminalNumber',
  'wireNumber',
  'cableId',
  'cableCore',
  'connector',
  'wireColour',
  'circuitClass',
  'hazardKind',
  'nominalVoltage',
  'currentKind',
  'frequency',
  'sourceImpedance',
  'bridgeGroup',
  'channelId',
  'notes',
] as const;

const selectClass =
  'h-10 w-full rounded-sm border border-line bg-panel px-2 text-sm text-ink aria-invalid:border-danger';

/** '' → null; engineering text → SI; unreadable text → NaN so the schema names the field. */
const engValue = (unit: UnitSymbol) => (v: unknown) => {
  if (v === null || v === undefined || (typeof v === 'string' && v.trim() === '')) return null;
  if (typeof v === 'number') return v;
  try {
    return parseEng(String(v), unit);
  } catch {
    return Number.NaN;
  }
};
const wholeValue = (v: unknown) =>
  v === '' || v === null || v === undefined ? undefined : Number(v);
const idOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));
const textOrNull = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? null : v);

/** Add a terminal, or edit every field of one (only the changed fields are sent, with its version). */
export function TerminalForm({
  projectId,
  cabinetId,
  strips,
  channels,
  terminal,
  defaults,
  onDone,
}: {
  projectId: number;
  cabinetId: number;
  strips: Strip[];
  channels: ChannelRow[];
  terminal?: TerminalRow;
  defaults?: Partial<TerminalFields>;
  onDone: (saved: TerminalRow | null) => void;
}) {
  const queryClient = useQueryClient();
  const api = projectApi(projectId);
  const [failure, setFailure] = useState<string | null>(null);
  const start: Partial<TerminalFields> = terminal ?? {
    stripId: strips[0]?.id,
    level: 1,
    circuitClass: 'spare',
    ...defaults,
  };
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<TerminalCreateInput>({
    resolver: zodResolver(terminalCreateSchema),
    defaultValues: Object.fromEntries(
      FIELDS.map((f) => [f, start[f] ?? (f === 'circuitClass' ? 'spare' : null)]),
    ) as TerminalCreateInput,
  });
  const circuitClass = watch('circuitClass');
  const currentKind = watch('currentKind');

  const remove = async () => {
    if (
      !terminal ||
      !window.confirm(`Delete terminal ${terminal.label}? Channels that use it lose that terminal.`)
    )
      return;
    setFailure(null);
    try {
      await api.deleteTerminal(terminal.id, terminal.version);
      await queryClient.invalidateQueries({ queryKey: keys.terminals(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.strips(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.channels(projectId, cabinetId) });
      onDone(null);
    } catch (error) {
      setFailure(error instanceof Error ? error.message : String(error));
    }
  };

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      let saved: TerminalRow;
      if (terminal) {
        const changes = Object.fromEntries(
          Object.entries(values).filter(
            ([k, v]) => (terminal[k as keyof TerminalRow] ?? null) !== (v ?? null),
          ),
        );
        saved = await api.updateTerminal(terminal.id, terminal.version, changes);
      } else {
        saved = await api.createTerminal(values as Parameters<typeof api.createTerminal>[0]);
      }
      await queryClient.invalidateQueries({ queryKey: keys.terminals(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.strips(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.channels(projectId, cabinetId) });
      onDone(saved);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  });

  const e = (f: (typeof FIELDS)[number]) => errors[f]?.message;
  const text = (f: (typeof FIELDS)[number], label: string, hint?: string, mono = true) => (
    <Field id={`t-${f}`} label={label} hint={hint} error={e(f)}>
      <Input
        {...ariaFor(`t-${f}`, e(f))}
        className={mono ? 'font-mono' : undefined}
        {...register(f, { setValueAs: textOrNull })}
      />
    </Field>
  );
  const eng = (
    f: 'nominalVoltage' | 'frequency' | 'sourceImpedance',
    label: string,
    unit: UnitSymbol,
    hint: string,
  ) => (
    <Field id={`t-${f}`} label={label} hint={hint} error={e(f)}>
      <Input
        {...ariaFor(`t-${f}`, e(f))}
        className="font-mono"
        inputMode="decimal"
        {...register(f, { setValueAs: engValue(unit) })}
      />
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-4">
        <Field id="t-stripId" label="Strip" error={e('stripId')}>
          <select
            {...ariaFor('t-stripId', e('stripId'))}
            className={selectClass}
            {...register('stripId', { setValueAs: wholeValue })}
          >
            {strips.map((s) => (
              <option key={s.id} value={s.id}>
                {s.tag}
              </option>
            ))}
          </select>
        </Field>
        <Field id="t-position" label="Position" error={e('position')}>
          <Input
            {...ariaFor('t-position', e('position'))}
            inputMode="numeric"
            className="font-mono"
            {...register('position', { setValueAs: wholeValue })}
          />
        </Field>
        <Field id="t-level" label="Level" hint="1 = bottom" error={e('level')}>
          <Input
            {...ariaFor('t-level', e('level'))}
            inputMode="numeric"
            className="font-mono"
            {...register('level', { setValueAs: wholeValue })}
          />
        </Field>
        {text('blockId', 'Block', 'Shared by stacked levels')}
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        {text('label', 'Label', 'Printed marker, e.g. X3:14')}
        {text('terminalNumber', 'Terminal no.')}
        {text('wireNumber', 'Wire no.')}
        {text('cableId', 'Cable')}
        {text('cableCore', 'Core')}
        {text('connector', 'Connector')}
        {text('wireColour', 'Colour')}
        {text('bridgeGroup', 'Bridge group', 'Same group = jumpered')}
        <Field id="t-channelId" label="Channel" error={e('channelId')}>
          <select
            {...ariaFor('t-channelId', e('channelId'))}
            className={selectClass}
            {...register('channelId', { setValueAs: idOrNull })}
          >
            <option value="">none</option>
            {channels.map((c) => (
              <option key={c.id} value={c.id}>
                {c.tag}
              </option>
            ))}
          </select>
        </Field>
      </div>
      <fieldset className="grid min-w-0 gap-3 rounded-sm border border-line p-3 sm:grid-cols-3">
        <legend className="px-1 text-sm font-medium">Electrical facts</legend>
        <Field id="t-circuitClass" label="Circuit class" error={e('circuitClass')}>
          <select
            {...ariaFor('t-circuitClass', e('circuitClass'))}
            className={selectClass}
            {...register('circuitClass')}
          >
            {CIRCUIT_CLASSES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </Field>
        {circuitClass === 'hazard' ? (
          <>
            <Field id="t-hazardKind" label="Hazard kind" error={e('hazardKind')}>
              <select
                {...ariaFor('t-hazardKind', e('hazardKind'))}
                className={selectClass}
                {...register('hazardKind', { setValueAs: textOrNull })}
              >
                <option value="">—</option>
                {HAZARD_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {k}
                  </option>
                ))}
              </select>
            </Field>
            <Field id="t-currentKind" label="AC / DC" error={e('currentKind')}>
              <select
                {...ariaFor('t-currentKind', e('currentKind'))}
                className={selectClass}
                {...register('currentKind', { setValueAs: textOrNull })}
              >
                <option value="">—</option>
                {CURRENT_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {k}
                  </option>
                ))}
              </select>
            </Field>
            {eng('nominalVoltage', 'Nominal voltage', 'V', 'V, RMS for AC: 230, 24V, 400')}
            {currentKind === 'ac' ? eng('frequency', 'Frequency', 'Hz', 'Hz: 50 or 60') : null}
            {eng(
              'sourceImpedance',
              'Source impedance',
              'Ω',
              'Ω: 0R5, 2, 10k; blank = default for its kind',
            )}
          </>
        ) : (
          eng('nominalVoltage', 'Nominal voltage', 'V', 'Optional: V of the signal')
        )}
      </fieldset>
      <Field id="t-notes" label="Notes" error={e('notes')}>
        <textarea
          {...ariaFor('t-notes', e('notes'))}
          rows={2}
          className="w-full rounded-sm border border-line bg-panel p-2 text-sm"
          {...register('notes', { setValueAs: textOrNull })}
        />
      </Field>
      <FormFooter
        failure={failure}
        submitting={isSubmitting}
        submitLabel={terminal ? 'Save terminal' : 'Add terminal'}
        onCancel={() => onDone(null)}
        extra={
          terminal ? (
            <Button variant="danger" className="mr-auto" onClick={() => void remove()}>
              Delete terminal
            </Button>
          ) : null
        }
      />
    </form>
  );
}
