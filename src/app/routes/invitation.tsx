import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { QueryError } from '../../components/ui/query-error';
import { fetchSignedInPerson, meQueryOptions, resetCacheForPerson } from '../../features/auth/api/session';
import { invitationQueryOptions } from '../../features/invitations/api/invitations';
import { AcceptInvitationForm } from '../../features/invitations/components/accept-invitation-form';
import { isApiError } from '../../lib/api-client';
import { PageTitle } from '../../components/ui/page-title';

export function InvitationRoute() {
  const { token = '' } = useParams();
  const invitation = useQuery(invitationQueryOptions(token));
  const { data: me } = useQuery(meQueryOptions());
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  let body;
  if (invitation.isPending) body = <Loading label="Checking the invitation…" />;
  else if (invitation.isError) {
    const gone = isApiError(invitation.error) && [400, 404, 410].includes(invitation.error.status);
    body = gone ? (
      <div className="flex flex-col gap-4">
        <Notice tone="caution" title="This invitation cannot be used">
          The link is not valid any more: it may have been used already or have expired. Ask your administrator for a new
          invitation.
        </Notice>
        <Link to="/sign-in" className={buttonClass('secondary', 'self-start')}>
          Go to sign-in
        </Link>
      </div>
    ) : (
      <QueryError error={invitation.error} retry={() => void invitation.refetch()} what="the invitation" />
    );
  } else {
    body = (
      <>
        {me ? (
          <div className="mb-5">
            <Notice tone="caution" title={`You are signed in as ${me.email}`}>
              Accepting signs you in as the invited person instead.
            </Notice>
          </div>
        ) : null}
        <AcceptInvitationForm
          token={token}
          invitation={invitation.data}
          onAccepted={async () => {
            resetCacheForPerson(queryClient, await fetchSignedInPerson());
            navigate('/projects', { replace: true });
          }}
        />
      </>
    );
  }

  return (
    <div className="mx-auto w-full max-w-lg">
      <PageTitle title="Join" />
      <section aria-labelledby="invitation-title" className="rounded-plate border border-paper-line bg-paper-raised p-6 shadow-sm sm:p-8">
        <h1 id="invitation-title" className="mb-4 text-title font-semibold text-ink">
          Join Stillspan
        </h1>
        {body}
      </section>
    </div>
  );
}
