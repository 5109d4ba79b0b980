import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { createInvitationSchema, roles } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { applyServerIssues } from '../../../lib/form-errors';
import { describeRole, formatRole } from '../../../lib/format';
import { useInviteMember } from '../api/members';

type InviteValues = z.input<typeof createInvitationSchema>;
const inviteFields = createInvitationSchema.keyof().options;

export function InviteForm() {
  const invite = useInviteMember();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors },
  } = useForm<InviteValues, unknown, z.output<typeof createInvitationSchema>>({
    resolver: zodResolver(createInvitationSchema),
    defaultValues: { email: '', name: undefined, role: 'engineer' },
  });
  const role = useWatch({ control, name: 'role' });

  const onSubmit = handleSubmit((values) => {
    setSentTo(null);
    setFormError(null);
    invite.mutate(values, {
      onSuccess: () => {
        setSentTo(values.email);
        reset({ email: '', name: undefined, role: values.role });
      },
      onError: (error) => setFormError(applyServerIssues(error, inviteFields, setError)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite a person" className="flex flex-col gap-5">
      {sentTo ? (
        <Notice tone="success" title="Invitation sent">
          An invitation link is on its way to {sentTo}. It appears under pending invitations until it is accepted.
        </Notice>
      ) : null}
      {formError ? (
        <Notice tone="error" title="The invitation was not sent">
          {formError}
        </Notice>
      ) : null}
      <div className="grid gap-4 md:grid-cols-3">
        <TextField label="E-mail" type="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <TextField
          label="Name"
          optional
          autoComplete="off"
          error={errors.name?.message}
          {...register('name', { setValueAs: (value: string) => (value && value.trim() ? value : undefined) })}
        />
        <SelectField label="Role" hint={role ? describeRole(role) : undefined} error={errors.role?.message} {...register('role')}>
          {roles.map((option) => (
            <option key={option} value={option}>
              {formatRole(option)}
            </option>
          ))}
        </SelectField>
      </div>
      <div>
        <Button type="submit" busy={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
