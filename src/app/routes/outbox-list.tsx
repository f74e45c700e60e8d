import { useQuery } from '@tanstack/react-query';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/spinner';
import { meQueryOptions } from '../../features/auth';
import { outboxQueryOptions, AdminsOnly, OutboxTable } from '../../features/outbox';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function OutboxListPage() {
  const me = useQuery(meQueryOptions);
  const admin = me.data?.isAdmin === true;
  const messages = useQuery({ ...outboxQueryOptions(), enabled: admin });

  return (
    <PageColumn>
      <PageTitle>Outbox</PageTitle>
      <div className="flex flex-col gap-4">
        <div>
          <h1 className="text-lg font-semibold text-slate-100">Outbox</h1>
          <p className="mt-1 text-sm text-slate-400">Every e-mail this server has sent: invitations, member notices and password resets.</p>
        </div>
        {!admin ? (
          <AdminsOnly />
        ) : messages.isPending ? (
          <LoadingState label="Loading messages…" />
        ) : messages.isError ? (
          <ErrorState error={messages.error} onRetry={() => messages.refetch()} />
        ) : messages.data.length === 0 ? (
          <EmptyState title="No messages yet">Invitations and password-reset mails appear here as soon as the server sends them.</EmptyState>
        ) : (
          <OutboxTable messages={messages.data} />
        )}
      </div>
    </PageColumn>
  );
}
