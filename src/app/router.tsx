import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { AppShell } from './layout/app-shell';
import { HomeRoute } from './routes/home';
import { NotFoundRoute } from './routes/not-found';

// Feature pages are added here as lazy routes so the first paint stays small.
export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppShell />,
    children: [
      { index: true, element: <HomeRoute /> },
      { path: 'compare', lazy: () => import('./routes/compare') },
      { path: 'studies/:studyId', lazy: () => import('./routes/study-workspace') },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
  // The printable report is a document of its own: no app header or footer on paper.
  { path: '/report', lazy: () => import('./routes/report') },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
