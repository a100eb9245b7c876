import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { AppShell } from './layout/app-shell';
import { AccountBar } from '../features/auth/components/account-bar';
import { HomeRoute } from './routes/home';
import { NotFoundRoute } from './routes/not-found';

// Feature pages are added here as lazy routes so the first paint stays small.
export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppShell extraNav={[{ to: '/team', label: 'Team' }]} account={<AccountBar />} />,
    children: [
      { index: true, element: <HomeRoute /> },
      { path: 'compare', lazy: () => import('./routes/compare') },
      { path: 'studies/:studyId', lazy: () => import('./routes/study-workspace') },
      // Team study library
      { path: 'sign-in', lazy: () => import('./routes/library/sign-in') },
      { path: 'team', lazy: () => import('./routes/library/team-picker') },
      { path: 'teams/:teamId', lazy: () => import('./routes/library/team-home') },
      { path: 'teams/:teamId/members', lazy: () => import('./routes/library/members') },
      { path: 'parts/:partId', lazy: () => import('./routes/library/part') },
      { path: 'studies/:studyId/history', lazy: () => import('./routes/library/study-history') },
      { path: 'invite/:token', lazy: () => import('./routes/library/accept-invite') },
      { path: 'dev/mailbox', lazy: () => import('./routes/library/mailbox') },
      { path: 'admin', lazy: () => import('./routes/library/admin') },
      // Run logs and reviews
      { path: 'studies/:studyId/run-logs', lazy: () => import('./routes/run-logs/study-run-logs') },
      { path: 'parts/:partId/run-logs', lazy: () => import('./routes/run-logs/part-run-logs') },
      { path: 'run-logs/:runLogId', lazy: () => import('./routes/run-logs/run-log') },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
  // The printable report is a document of its own: no app header or footer on paper.
  { path: '/report', lazy: () => import('./routes/report') },
  { path: '/run-logs/:runLogId/record', lazy: () => import('./routes/run-logs/review-record') },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
