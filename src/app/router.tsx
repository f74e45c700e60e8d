import { lazy, Suspense, type ComponentType } from 'react';
import { createBrowserRouter, Navigate, RouterProvider, type RouteObject } from 'react-router-dom';
import { LoadingState } from '../components/ui/spinner';
import { RequireUser, RootLayout } from './layout';
import { BoardPage } from './routes/board-page';
import { BuildSheetPage } from '../features/build';
import { NotFoundPage, RouteError } from './routes/route-error';

/**
 * A page whose code is a chunk of its own, fetched when the page is first shown: the main script, which
 * runs before a board's canvas can draw, holds only the board page (and the layout). A spinner stands in
 * while the chunk loads.
 */
function lazyPage<M>(load: () => Promise<M>, pick: (m: M) => ComponentType): ComponentType {
  const Page = lazy(() => load().then((m) => ({ default: pick(m) })));
  return function LazyPage() {
    return (
      <Suspense fallback={<LoadingState />}>
        <Page />
      </Suspense>
    );
  };
}

const SignInPage = lazyPage(() => import('./routes/sign-in'), (m) => m.SignInPage);
const SignUpPage = lazyPage(() => import('./routes/sign-up'), (m) => m.SignUpPage);
const ResetRequestPage = lazyPage(() => import('./routes/reset-request'), (m) => m.ResetRequestPage);
const ResetPasswordPage = lazyPage(() => import('./routes/reset-password'), (m) => m.ResetPasswordPage);
const InvitationAcceptPage = lazyPage(() => import('./routes/invitation-accept'), (m) => m.InvitationAcceptPage);
const SharePage = lazyPage(() => import('./routes/share-page'), (m) => m.SharePage);
const BoardsListPage = lazyPage(() => import('./routes/boards-list'), (m) => m.BoardsListPage);
const BoardMembersPage = lazyPage(() => import('./routes/board-members'), (m) => m.BoardMembersPage);
const OutboxListPage = lazyPage(() => import('./routes/outbox-list'), (m) => m.OutboxListPage);
const OutboxMessagePage = lazyPage(() => import('./routes/outbox-message'), (m) => m.OutboxMessagePage);

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
          page('boards/:id/build-sheet', <Suspense fallback={<LoadingState />}><BuildSheetPage /></Suspense>),
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
