import type { QueryClient } from '@tanstack/react-query';
import { Navigate, type RouteObject, createBrowserRouter } from 'react-router-dom';
import { PageLoading } from '../components/ui/spinner';
import type { Area } from '../config/navigation';
import { defaultSignedInPath, paths } from '../config/paths';
import { RequireAuth, RequireRole, currentUserQueryOptions } from '../lib/auth';
import { prefetchFirstWeek } from './routes/calendar/calendar-prefetch';
import { RouteErrorPage } from './routes/errors/route-error';

type LazyPage = NonNullable<RouteObject['lazy']>;

/** A signed-in area: the role guard from config/navigation wraps the lazily loaded page. */
function areaRoute(area: Area, path: string, lazy: LazyPage, loader?: () => null): RouteObject {
  return { element: <RequireRole area={area} />, children: [{ path, lazy, loader }] };
}

// Loaders run while the page's script is still downloading; they only start queries (never awaited, so no page
// waits on them) and the components read the same cache.
export const createRoutes = (queryClient: QueryClient): RouteObject[] => [
  {
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <PageLoading />,
    children: [
      {
        path: paths.signIn,
        lazy: async () => ({ Component: (await import('./routes/auth/sign-in')).SignInPage }),
      },
      {
        path: paths.forgotPassword,
        lazy: async () => ({ Component: (await import('./routes/auth/forgot-password')).ForgotPasswordPage }),
      },
      {
        path: paths.resetPassword,
        lazy: async () => ({ Component: (await import('./routes/auth/reset-password')).ResetPasswordPage }),
      },
      {
        path: paths.acceptInvitation,
        lazy: async () => ({ Component: (await import('./routes/auth/accept-invitation')).AcceptInvitationPage }),
      },
      {
        element: <RequireAuth />,
        loader: () => {
          void queryClient.prefetchQuery(currentUserQueryOptions());
          return null;
        },
        children: [
          {
            lazy: async () => ({ Component: (await import('./routes/app-root')).AppRoot }),
            children: [
              { index: true, element: <Navigate to={defaultSignedInPath} replace /> },
              areaRoute(
                'calendar',
                paths.calendar,
                async () => ({ Component: (await import('./routes/calendar/calendar')).CalendarPage }),
                () => {
                  void prefetchFirstWeek(queryClient);
                  return null;
                },
              ),
              areaRoute('calendar', paths.planDay, async () => ({
                Component: (await import('./routes/calendar/plan-day')).PlanDayPage,
              })),
              areaRoute('sessions', paths.sessions, async () => ({
                Component: (await import('./routes/sessions/sessions')).SessionsPage,
              })),
              areaRoute('sessions', paths.sessionLog, async () => ({
                Component: (await import('./routes/sessions/session-log')).SessionLogPage,
              })),
              areaRoute('billing', paths.billing, async () => ({
                Component: (await import('./routes/billing/billing')).BillingPage,
              })),
              areaRoute('reports', paths.reports, async () => ({
                Component: (await import('./routes/reports/reports')).ReportsPage,
              })),
              areaRoute('settings', paths.settings, async () => ({
                Component: (await import('./routes/settings/settings')).SettingsPage,
              })),
              areaRoute('people', paths.people, async () => ({
                Component: (await import('./routes/people/people')).PeoplePage,
              })),
              areaRoute('sources', paths.sources, async () => ({
                Component: (await import('./routes/instruments/sources')).SourcesPage,
              })),
              areaRoute('beam-time', paths.myBeamTime, async () => ({
                Component: (await import('./routes/beam-time/my-beam-time')).MyBeamTimePage,
              })),
              areaRoute('training', paths.training, async () => ({
                Component: (await import('./routes/training/training')).TrainingPage,
              })),
            ],
          },
        ],
      },
      {
        path: '*',
        lazy: async () => ({ Component: (await import('./routes/errors/not-found')).NotFoundPage }),
      },
    ],
  },
];

export const createAppRouter = (queryClient: QueryClient) => createBrowserRouter(createRoutes(queryClient));
