import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { submitSignOffSchema, type SubmitSignOffInput } from '../../../../shared/contracts/sign-offs';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError, isApiError, issueMessage, issuesFor } from '../../../lib/api-client';
import { useSubmitSignOff } from '../api/sign-offs';

const signOffPath = (projectId: string) => `/projects/${projectId}/sign-off`;

/** An engineer sends a variant, with its criteria and results as they stand, to the owner for sign-off. */
export function SubmitSignOff({ projectId, variantId }: { projectId: string; variantId: string }) {
  const submit = useSubmitSignOff(projectId);
  const { register, handleSubmit, setError, formState } = useForm<SubmitSignOffInput>({
    resolver: zodResolver(submitSignOffSchema),
    defaultValues: { variantId, message: '' },
  });

  if (submit.isSuccess) {
    return (
      <Notice tone="success" title="Submitted for sign-off">
        The owner has been asked to decide.{' '}
        <Link to={signOffPath(projectId)} className="font-semibold underline">
          Open the sign-off page
        </Link>
      </Notice>
    );
  }

  const conflict = isApiError(submit.error) && submit.error.isConflict;
  return (
    <form
      aria-label="Submit for sign-off"
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit((values) => {
        const message = values.message?.trim();
        submit.mutate(
          { variantId: values.variantId, ...(message ? { message } : {}) },
          {
            onError: (error) => {
              const issues = issuesFor(error, 'message');
              if (issues.length > 0) setError('message', { type: 'server', message: issueMessage(issues[0]) });
            },
          },
        );
      })}
    >
      <p className="text-small text-ink-soft">
        The owner receives the comfort criteria, this variant and its results as they stand now; they approve the design or return it with a
        comment. An approved design can no longer be changed.
      </p>
      <TextAreaField label="Message to the owner" optional rows={3} error={formState.errors.message?.message} {...register('message')} />
      {conflict ? (
        <Notice tone="caution" title="Not submitted">
          {describeError(submit.error)}{' '}
          <Link to={signOffPath(projectId)} className="font-semibold underline">
            See the sign-offs
          </Link>
        </Notice>
      ) : submit.isError && issuesFor(submit.error, 'message').length === 0 ? (
        <Notice tone="error" title="Not submitted">
          {describeError(submit.error)}
        </Notice>
      ) : null}
      <div>
        <Button type="submit" busy={submit.isPending}>
          Submit for sign-off
        </Button>
      </div>
    </form>
  );
}
