/**
 * Every URL of the web app. Pages are lazy: each becomes its own chunk, so the public entry
 * carries only the shell (layout, nav, guards) and signed-in screens load when first visited.
 */
import { useState } from 'react'
import { Navigate, RouterProvider, createBrowserRouter, type RouteObject } from 'react-router-dom'
import { AppLayout, ShellFallback } from './layout/app-layout'
import { RequireAbility } from './guards/require-ability'
import { RouteError } from './routes/route-error'

export const routes: RouteObject[] = [
  {
    path: '/',
    element: <AppLayout />,
    errorElement: <RouteError standalone />,
    hydrateFallbackElement: <ShellFallback />,
    children: [
      {
        // Errors inside a page render here, within the header and footer.
        errorElement: <RouteError />,
        children: [
          { index: true, lazy: () => import('./routes/home') },
          { path: 'sign-in', lazy: () => import('./routes/sign-in') },
          { path: 'register', lazy: () => import('./routes/register') },
          { path: 'forgot-password', lazy: () => import('./routes/forgot-password') },
          { path: 'set-password', lazy: () => import('./routes/set-password') },
          { path: 'confirm-email', lazy: () => import('./routes/confirm-email') },
          { path: 'report', lazy: () => import('./routes/report') },
          { path: 'track', lazy: () => import('./routes/track') },
          { path: 'track/:token', lazy: () => import('./routes/track-token') },
          { path: 'dev/mailbox', lazy: () => import('./routes/dev-mailbox') },
          {
            element: <RequireAbility anyOf={['workAssignedCases', 'runOfficeQueue']} />,
            children: [{ path: 'work', lazy: () => import('./routes/work') }],
          },
          {
            // Administrators read every office's cases; the server gives them no moves.
            element: <RequireAbility anyOf={['readCases']} />,
            children: [
              { path: 'cases', lazy: () => import('./routes/cases') },
              { path: 'cases/:id', lazy: () => import('./routes/case') },
            ],
          },
          {
            element: <RequireAbility anyOf={['manageUsers']} />,
            children: [
              { path: 'admin', element: <Navigate to="/admin/users" replace /> },
              { path: 'admin/users', lazy: () => import('./routes/admin-users') },
            ],
          },
          {
            element: <RequireAbility anyOf={['manageOffices']} />,
            children: [{ path: 'admin/offices', lazy: () => import('./routes/admin-offices') }],
          },
          {
            element: <RequireAbility anyOf={['followOwnReports']} />,
            children: [
              { path: 'my-reports', lazy: () => import('./routes/my-reports') },
              { path: 'my-reports/:id', lazy: () => import('./routes/my-report') },
            ],
          },
          { path: '*', lazy: () => import('./routes/not-found') },
        ],
      },
    ],
  },
]

export function AppRouter() {
  const [router] = useState(() => createBrowserRouter(routes))
  return <RouterProvider router={router} />
}
