'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { cabinetCreateSchema, type CabinetCreateInput } from '@/lib/validation/cabinet';
import { keys, projectApi } from '../api';
import type { Cabinet } from '../types';
import { FormFooter } from './form-footer';
import { applyServerErrors, ariaFor } from './server-errors';

const FIELDS = ['tag', 'name', 'location'] as const;

/** Create a cabinet, or edit one (sending only the version it was read at plus the fields). */
export function CabinetForm({
  projectId,
  cabinet,
  onDone,
}: {
  projectId: number;
  cabinet?: Cabinet;
  onDone: (saved: Cabinet | null) => void;
}) {
  const queryClient = useQueryClient();
  const api = projectApi(projectId);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CabinetCreateInput>({
    resolver: zodResolver(cabinetCreateSchema),
    defaultValues: {
      tag: cabinet?.tag ?? '',
      name: cabinet?.name ?? '',
      location: cabinet?.location ?? '',
    },
  });
  const mutation = useMutation({
    mutationFn: (values: CabinetCreateInput) =>
      cabinet ? api.updateCabinet(cabinet.id, cabinet.version, values) : api.createCabinet(values),
    onSettled: () => queryClient.invalidateQueries({ queryKey: keys.cabinets(projectId) }),
  });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      onDone(await mutation.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      <Field
        id="cabinet-tag"
        label="Tag"
        hint="Unique in the project, e.g. +CP2"
        error={errors.tag?.message}
      >
        <Input
          {...ariaFor('cabinet-tag', errors.tag?.message)}
          className="font-mono"
          {...register('tag')}
        />
      </Field>
      <Field id="cabinet-name" label="Name" error={errors.name?.message}>
        <Input {...ariaFor('cabinet-name', errors.name?.message)} {...register('name')} />
      </Field>
      <Field
        id="cabinet-location"
        label="Location"
        hint="Room, area or grid reference"
        error={errors.location?.message}
      >
        <Input
          {...ariaFor('cabinet-location', errors.location?.message)}
          {...register('location')}
        />
      </Field>
      <FormFooter
        failure={failure}
        submitting={isSubmitting}
        submitLabel={cabinet ? 'Save cabinet' : 'Create cabinet'}
        onCancel={() => onDone(null)}
      />
    </form>
  );
}
