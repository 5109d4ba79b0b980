import { useQuery } from '@tanstack/react-query';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { PageHeader } from '../../components/ui/page-header';
import { PageTitle } from '../../components/ui/page-title';
import { QueryError } from '../../components/ui/query-error';
import { appConfigQueryOptions } from '../../features/auth/api/session';
import { devMailQueryOptions } from '../../features/dev-mail/api/dev-mail';
import { MailList } from '../../features/dev-mail/components/mail-list';
import { NotFoundRoute } from './not-found';

/** Development and test only: the mails the local fake mail server caught, so their links can be followed. */
export function DevMailRoute() {
  const { data: config } = useQuery(appConfigQueryOptions());
  const enabled = config?.devMailbox ?? false;
  const mails = useQuery({ ...devMailQueryOptions(), enabled });

  if (!enabled) return <NotFoundRoute />;

  return (
    <div className="flex flex-col gap-8">
      <PageTitle title="Dev mailbox" />
      <PageHeader
        eyebrow={`${config?.mode ?? 'development'} server`}
        title="Mailbox"
        lead="Mail the server has sent while running outside production. Nothing here leaves this machine."
      />
      <Notice tone="info">This page lists every caught mail for anyone who opens it; it does not exist in production.</Notice>
      {mails.isPending ? (
        <Loading label="Loading caught mail…" />
      ) : mails.isError ? (
        <QueryError error={mails.error} retry={() => void mails.refetch()} what="the caught mail" />
      ) : (
        <MailList mails={mails.data} />
      )}
    </div>
  );
}
