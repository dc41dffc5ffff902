'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { stripCreateSchema, type StripCreateInput } from '@/lib/validation/strip';
import { keys, projectApi } from '../api';
import type { Strip } from '../types';
import { FormFooter } from './form-footer';
import { applyServerErrors, ariaFor } from './server-errors';

const FIELDS = ['tag', 'name', 'order'] as const;

export function StripForm({
  projectId,
  cabinetId,
  strip,
  onDone,
}: {
  projectId: number;
  cabinetId: number;
  strip?: Strip;
  onDone: (saved: Strip | null) => void;
}) {
  const queryClient = useQueryClient();
  const api = projectApi(projectId);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<StripCreateInput>({
    resolver: zodResolver(stripCreateSchema),
    defaultValues: { tag: strip?.tag ?? '', name: strip?.name ?? '', order: strip?.order },
  });

  const remove = async () => {
    if (!strip || !window.confirm(`Delete strip ${strip.tag}?`)) return;
    setFailure(null);
    try {
      await api.deleteStrip(strip.id, strip.version);
      await queryClient.invalidateQueries({ queryKey: keys.strips(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.cabinets(projectId) });
      onDone(null);
    } catch (error) {
      setFailure(error instanceof Error ? error.message : String(error));
    }
  };

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const saved = strip
        ? await api.updateStrip(strip.id, strip.version, values)
        : await api.createStrip(cabinetId, values);
      await queryClient.invalidateQueries({ queryKey: keys.strips(projectId, cabinetId) });
      await queryClient.invalidateQueries({ queryKey: keys.terminals(projectId, cabinetId) });
      void queryClient.invalidateQueries({ queryKey: keys.cabinets(projectId) });
      onDone(saved);
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      <Field
        id="strip-tag"
        label="Tag"
        hint="Unique in the cabinet, e.g. X4"
        error={errors.tag?.message}
      >
        <Input
          {...ariaFor('strip-tag', errors.tag?.message)}
          className="font-mono"
          {...register('tag')}
        />
      </Field>
      <Field
        id="strip-name"
        label="Name"
        hint="What the strip serves, e.g. Analog inputs"
        error={errors.name?.message}
      >
        <Input {...ariaFor('strip-name', errors.name?.message)} {...register('name')} />
      </Field>
      <Field
        id="strip-order"
        label="Order"
        hint="Drawing order in the cabinet; blank = after the last strip"
        error={errors.order?.message}
      >
        <Input
          {...ariaFor('strip-order', errors.order?.message)}
          inputMode="numeric"
          {...register('order', {
            setValueAs: (v: string | number | undefined) =>
              v === '' || v === undefined ? undefined : Number(v),
          })}
        />
      </Field>
      <FormFooter
        failure={failure}
        submitting={isSubmitting}
        submitLabel={strip ? 'Save strip' : 'Add strip'}
        onCancel={() => onDone(null)}
        extra={
          strip ? (
            <Button
              variant="danger"
              className="mr-auto"
              disabled={strip.terminalCount > 0}
              title={strip.terminalCount > 0 ? 'Move or delete its terminals first' : undefined}
              onClick={() => void remove()}
            >
              Delete strip
            </Button>
          ) : null
        }
      />
    </form>
  );
}
