import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { createStructureSchema, type Structure } from '../../../../shared/contracts';
import { FormActions, FormErrorNotice } from '../../../components/ui/form-actions';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { applyServerIssues } from '../../../lib/form-errors';
import { useCreateStructure, useUpdateStructure } from '../api/structures';
import {
  cleanStructureValues,
  emptyStructureForm,
  structureChanges,
  StructureFields,
  structureFormFields,
  structureToForm,
  type StructureFormValues,
} from './structure-fields';

export function CreateStructureForm({ projectId, onCreated, onCancel }: { projectId: string; onCreated: (structure: Structure) => void; onCancel: () => void }) {
  const createStructure = useCreateStructure(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<StructureFormValues>({ resolver: zodResolver(createStructureSchema), defaultValues: emptyStructureForm });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    createStructure.mutate(cleanStructureValues(values), {
      onSuccess: onCreated,
      onError: (error) => setFormError(applyServerIssues(error, structureFormFields, setError)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New structure" className="flex flex-col gap-5">
      <FormErrorNotice title="The structure was not added" error={formError} />
      <StructureFields register={register} errors={errors} idPrefix="new-structure" />
      <FormActions submitLabel="Add structure" busy={createStructure.isPending} onCancel={onCancel} />
    </form>
  );
}

export function EditStructureForm({ structure, onDone }: { structure: Structure; onDone: (saved: boolean) => void }) {
  const updateStructure = useUpdateStructure(structure.projectId, structure.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  // The version this form was opened on: a change stored meanwhile must be seen before saving over it.
  const [versionRead] = useState(structure.version);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isDirty },
  } = useForm<StructureFormValues>({ resolver: zodResolver(createStructureSchema), defaultValues: structureToForm(structure) });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setStale(false);
    updateStructure.mutate(structureChanges(values, versionRead), {
      onSuccess: () => onDone(true),
      onError: (error) => {
        if (isApiError(error) && error.isConflict) setStale(true);
        else setFormError(applyServerIssues(error, structureFormFields, setError));
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Edit structure" className="flex flex-col gap-5">
      {stale ? (
        <Notice tone="caution" title="Changed by someone else">
          Someone changed this structure after you opened it, so your changes were not saved. Cancel to see the stored
          details (fetched again just now), then make your change again.
        </Notice>
      ) : null}
      <FormErrorNotice title="The changes were not saved" error={formError} />
      <StructureFields register={register} errors={errors} idPrefix="edit-structure" />
      <FormActions submitLabel="Save changes" busy={updateStructure.isPending} disabled={!isDirty} onCancel={() => onDone(false)} />
    </form>
  );
}
