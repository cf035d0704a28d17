// Routes, one file each under routes/, loaded lazily. The signed-in layout's
// loader makes sure a session exists before any page inside it renders.
import { createBrowserRouter, redirect } from 'react-router-dom';
import { queryClient } from '../lib/query-client';
import { getSessionQueryOptions } from '../features/auth/api/session';

async function requireSession({ request }: { request: Request }) {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (!session) {
    const url = new URL(request.url);
    const next = url.pathname + url.search;
    throw redirect(next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`);
  }
  return null;
}

export const router = createBrowserRouter([
  { path: '/sign-in', lazy: () => import('./routes/sign-in') },
  {
    path: '/',
    loader: requireSession,
    // The session does not depend on a list's filters: changing them re-runs no loader.
    shouldRevalidate: ({ currentUrl, nextUrl, defaultShouldRevalidate }) =>
      currentUrl.pathname !== nextUrl.pathname ? defaultShouldRevalidate : false,
    lazy: () => import('./routes/signed-in-layout'),
    children: [
      { index: true, lazy: () => import('./routes/home') },
      { path: 'dashboard', lazy: () => import('./routes/dashboard') },
      { path: 'techniques', lazy: () => import('./routes/techniques') },
      { path: 'techniques/new', lazy: () => import('./routes/technique-new') },
      { path: 'techniques/:id', lazy: () => import('./routes/technique') },
      { path: 'techniques/:id/edit', lazy: () => import('./routes/technique-edit') },
      { path: 'materials', lazy: () => import('./routes/materials') },
      { path: 'audits', lazy: () => import('./routes/audits') },
      { path: 'audits/:id', lazy: () => import('./routes/audit') },
      { path: 'findings', lazy: () => import('./routes/findings') },
      { path: 'findings/:id', lazy: () => import('./routes/finding') },
      { path: 'actions', lazy: () => import('./routes/actions') },
      { path: 'actions/:id', lazy: () => import('./routes/action') },
      { path: 'registers/:tab?', lazy: () => import('./routes/registers') },
      { path: 'registers/equipment/:id/impact', lazy: () => import('./routes/equipment-impact') },
      { path: 'trail', lazy: () => import('./routes/trail') },
      { path: 'messages', lazy: () => import('./routes/messages') },
      // The page's earlier address keeps working.
      { path: 'mailbox', loader: () => redirect('/messages') },
      { path: 'admin/users', lazy: () => import('./routes/admin-users') },
      { path: 'admin/policy', lazy: () => import('./routes/admin-policy') },
      { path: '*', lazy: () => import('./routes/not-found') },
    ],
  },
]);
