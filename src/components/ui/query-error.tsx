import { describeError, isApiError } from '../../lib/api-client';
import { Button } from './button';
import { Notice } from './notice';

/** The error of a failed query, with a retry for what may pass on a second try. */
export function QueryError({ error, retry, what }: { error: unknown; retry?: () => void; what: string }) {
  const canRetry = retry && !(isApiError(error) && error.isClientError);
  return (
    <Notice
      tone="error"
      title={`Could not load ${what}`}
      action={
        canRetry ? (
          <Button tone="secondary" onClick={retry}>
            Try again
          </Button>
        ) : undefined
      }
    >
      {describeError(error)}
    </Notice>
  );
}
