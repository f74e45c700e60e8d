import { useQuery } from '@tanstack/react-query';
import { Suspense } from 'react';
import { useNavigate } from 'react-router-dom';
import { Card, CardBody, CardHeader } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { ErrorState } from '../../components/ui/error-state';
import { LoadingState } from '../../components/ui/spinner';
import { boardsQueryOptions, BoardsTable, CreateBoardForm } from '../../features/boards';
import { PageColumn } from '../layout';
import { ImportBoardButton } from '../../features/canvas';
import { PageTitle } from '../../components/ui/page-title';

export function BoardsListPage() {
  const boards = useQuery(boardsQueryOptions());
  const navigate = useNavigate();
  return (
    <PageColumn>
      <PageTitle>Boards</PageTitle>
      <div className="flex flex-col gap-6">
        <Card>
          <CardHeader title="New board" subtitle="Start an empty schematic; invite people once it exists." />
          <CardBody>
            <CreateBoardForm onCreated={(b) => navigate(`/boards/${b.id}`)} />
          </CardBody>
        </Card>
        <section aria-labelledby="boards-heading" className="flex flex-col gap-3">
          <div className="flex items-center justify-between gap-3">
            <h1 id="boards-heading" className="text-lg font-semibold text-slate-100">
              Your boards
            </h1>
            <ImportBoardButton />
          </div>
          {boards.isPending ? (
            <LoadingState label="Loading your boards…" />
          ) : boards.isError ? (
            <ErrorState error={boards.error} onRetry={() => boards.refetch()} />
          ) : boards.data.length === 0 ? (
            <EmptyState title="No boards yet">
              Give your first circuit a title above — a half adder is a good start — and it opens on an empty bench, ready for
              parts from the parts tray.
            </EmptyState>
          ) : (
            // the table's code is a chunk of its own
            <Suspense fallback={<LoadingState />}>
              <BoardsTable boards={boards.data} />
            </Suspense>
          )}
        </section>
      </div>
    </PageColumn>
  );
}
