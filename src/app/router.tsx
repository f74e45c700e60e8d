import { createBrowserRouter, Navigate, RouterProvider, type RouteObject } from 'react-router-dom';
import { RequireUser, RootLayout } from './layout';
import { BoardMembersPage } from './routes/board-members';
import { BoardPage } from './routes/board-page';
import { BoardsListPage } from './routes/boards-list';
import { BuildSheetPage } from '../features/build';
import { InvitationAcceptPage } from './routes/invitation-accept';
import { OutboxListPage } from './routes/outbox-list';
import { OutboxMessagePage } from './routes/outbox-message';
import { ResetPasswordPage } from './routes/reset-password';
import { ResetRequestPage } from './routes/reset-request';
import { NotFoundPage, RouteError } from './routes/route-error';
import { SignInPage } from './routes/sign-in';
import { SignUpPage } from './routes/sign-up';
import { SharePage } from './routes/share-page';

// Every route carries its own error boundary, so a failure in one page keeps the top bar and the
// rest of the app usable.
const errorElement = <RouteError />;

const page = (path: string, element: React.ReactNode): RouteObject => ({ path, element, errorElement });

/** The client's routes (the addresses are part of the API agreement: links in e-mails use them). */
export const routes: RouteObject[] = [
  {
    element: <RootLayout />,
    errorElement,
    children: [
      { index: true, element: <Navigate to="/boards" replace />, errorElement },
      page('signin', <SignInPage />),
      page('signup', <SignUpPage />),
      page('reset', <ResetRequestPage />),
      page('reset/:token', <ResetPasswordPage />),
      page('invitations/:token', <InvitationAcceptPage />),
      page('s/:token', <SharePage />),
      {
        element: <RequireUser />,
        errorElement,
        children: [
          page('boards', <BoardsListPage />),
          page('boards/:id', <BoardPage />),
          page('boards/:id/members', <BoardMembersPage />),
          page('boards/:id/build-sheet', <BuildSheetPage />),
          page('outbox', <OutboxListPage />),
          page('outbox/:id', <OutboxMessagePage />),
        ],
      },
      page('*', <NotFoundPage />),
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
