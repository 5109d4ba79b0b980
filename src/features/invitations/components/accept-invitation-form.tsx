import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { acceptInvitationSchema, type AcceptInvitationInput, type InvitationPreview } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { applyServerIssues } from '../../../lib/form-errors';
import { formatRole } from '../../../lib/format';
import { useAcceptInvitation } from '../api/invitations';

const acceptFields = acceptInvitationSchema.keyof().options;
const passwordMinLength = acceptInvitationSchema.shape.password.minLength;

interface AcceptInvitationFormProps {
  token: string;
  invitation: InvitationPreview;
  onAccepted: () => void;
}

export function AcceptInvitationForm({ token, invitation, onAccepted }: AcceptInvitationFormProps) {
  const accept = useAcceptInvitation(token);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<AcceptInvitationInput>({ resolver: zodResolver(acceptInvitationSchema), defaultValues: { name: '', password: '' } });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    accept.mutate(
      { ...values, email: invitation.email },
      {
        onSuccess: onAccepted,
        onError: (error) => setFormError(applyServerIssues(error, acceptFields, setError)),
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Accept the invitation" className="flex flex-col gap-5">
      <p className="text-body text-ink-soft">
        You are invited to join <strong className="text-ink">{invitation.organisationName}</strong> as{' '}
        <strong className="text-ink">{formatRole(invitation.role).toLowerCase()}</strong>. Your account will use the e-mail
        address <strong className="text-ink">{invitation.email}</strong>.
      </p>
      {formError ? (
        <Notice tone="error" title="The invitation was not accepted">
          {formError}
        </Notice>
      ) : null}
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`Choose one of at least ${passwordMinLength} characters; you sign in with it and this e-mail address.`}
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" busy={accept.isPending} className="w-full py-2.5">
        Join and sign in
      </Button>
    </form>
  );
}
