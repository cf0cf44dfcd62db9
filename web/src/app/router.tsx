/**
 * Every URL of the web app. Pages are lazy: each becomes its own chunk, so the public entry
 * carries only the shell (layout, nav, guards) and signed-in screens load when first visited.
 * The patterns are those of lib/paths.ts, which also builds every link to them.
 */
import { useState } from 'react'
import { Navigate, RouterProvider, createBrowserRouter, type RouteObject } from 'react-router-dom'
import { paths } from '@/lib/paths'
import { AppLayout, ShellFallback } from './layout/app-layout'
import { RequireAbility } from './guards/require-ability'
import { RouteError } from './routes/route-error'

export const routes: RouteObject[] = [
  {
    path: paths.home.path,
    element: <AppLayout />,
    errorElement: <RouteError standalone />,
    hydrateFallbackElement: <ShellFallback />,
    children: [
      {
        // Errors inside a page render here, within the header and footer.
        errorElement: <RouteError />,
        children: [
          { index: true, lazy: () => import('./routes/home') },
          { path: paths.signIn.path, lazy: () => import('./routes/sign-in') },
          { path: paths.register.path, lazy: () => import('./routes/register') },
          { path: paths.forgotPassword.path, lazy: () => import('./routes/forgot-password') },
          { path: paths.setPassword.path, lazy: () => import('./routes/set-password') },
          { path: paths.confirmEmail.path, lazy: () => import('./routes/confirm-email') },
          { path: paths.report.path, lazy: () => import('./routes/report') },
          { path: paths.track.path, lazy: () => import('./routes/track') },
          { path: paths.trackReport.path, lazy: () => import('./routes/track-token') },
          { path: paths.devMailbox.path, lazy: () => import('./routes/dev-mailbox') },
          { path: paths.apiReference.path, lazy: () => import('./routes/api-reference') },
          // every signed-in person (the page asks them to sign in otherwise)
          { path: paths.myEmails.path, lazy: () => import('./routes/my-emails') },
          {
            element: <RequireAbility anyOf={['workAssignedCases', 'runOfficeQueue']} />,
            children: [{ path: paths.work.path, lazy: () => import('./routes/work') }],
          },
          {
            element: <RequireAbility anyOf={['runOfficeQueue']} />,
            children: [{ path: paths.officeSettings.path, lazy: () => import('./routes/office-settings') }],
          },
          {
            element: <RequireAbility anyOf={['readDashboard']} />,
            children: [{ path: paths.dashboard.path, lazy: () => import('./routes/dashboard') }],
          },
          {
            // Administrators read every office's cases; the server gives them no moves.
            element: <RequireAbility anyOf={['readCases']} />,
            children: [
              { path: paths.cases.path, lazy: () => import('./routes/cases') },
              { path: paths.case.path, lazy: () => import('./routes/case') },
            ],
          },
          {
            element: <RequireAbility anyOf={['manageUsers']} />,
            children: [
              { path: paths.admin.path, element: <Navigate to={paths.adminUsers.href()} replace /> },
              { path: paths.adminUsers.path, lazy: () => import('./routes/admin-users') },
            ],
          },
          {
            element: <RequireAbility anyOf={['manageOffices']} />,
            children: [
              { path: paths.adminOffices.path, lazy: () => import('./routes/admin-offices') },
              { path: paths.adminOfficeNew.path, lazy: () => import('./routes/admin-office-new') },
              { path: paths.adminOfficeEdit.path, lazy: () => import('./routes/admin-office-edit') },
            ],
          },
          {
            element: <RequireAbility anyOf={['readAudit']} />,
            children: [{ path: paths.adminAudit.path, lazy: () => import('./routes/admin-audit') }],
          },
          {
            element: <RequireAbility anyOf={['readBandLimits']} />,
            children: [{ path: paths.bandLimits.path, lazy: () => import('./routes/band-limits') }],
          },
          {
            element: <RequireAbility anyOf={['readStationRegister']} />,
            children: [{ path: paths.stationRegister.path, lazy: () => import('./routes/station-register') }],
          },
          {
            element: <RequireAbility anyOf={['readEquipment']} />,
            children: [{ path: paths.equipment.path, lazy: () => import('./routes/equipment') }],
          },
          {
            // staff: the calculator judges against the band-limit list, as the workbench does
            element: <RequireAbility anyOf={['readBandLimits']} />,
            children: [{ path: paths.calculator.path, lazy: () => import('./routes/calculator') }],
          },
          {
            element: <RequireAbility anyOf={['followOwnReports']} />,
            children: [
              { path: paths.myReports.path, lazy: () => import('./routes/my-reports') },
              { path: paths.myReport.path, lazy: () => import('./routes/my-report') },
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
