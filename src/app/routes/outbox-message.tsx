import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/spinner';
import { meQueryOptions } from '../../features/auth';
import { outboxMessageQueryOptions, AdminsOnly, MessageView } from '../../features/outbox';
import { useIdParam } from '../../lib/use-id-param';
import { PageColumn } from '../layout';
import { PageTitle } from '../../components/ui/page-title';

export function OutboxMessagePage() {
  const id = useIdParam();
  const me = useQuery(meQueryOptions);
  const admin = me.data?.isAdmin === true;
  const message = useQuery({ ...outboxMessageQueryOptions(id ?? 0), enabled: admin && id !== null });

  let body;
  if (!admin) body = <AdminsOnly />;
  else if (id === null) body = <ErrorState error={new Error('A message address ends in its number, like /outbox/3.')} title="Not a message address" />;
  else if (message.isPending) body = <LoadingState label="Loading the message…" />;
  else if (message.isError) body = <ErrorState error={message.error} onRetry={() => message.refetch()} />;
  else body = <MessageView message={message.data} />;

  return (
    <PageColumn>
      <PageTitle>{message.data?.subject || 'Message'}</PageTitle>
      <div className="flex flex-col gap-4">
        <Link to="/outbox" className="text-sm text-amber-300 hover:underline">
          ← All messages
        </Link>
        {body}
      </div>
    </PageColumn>
  );
}
