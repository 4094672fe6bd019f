import type { ComponentType } from 'react';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { LoadingState } from '../components/ui/states';
import { paths } from '../config/paths';
import { AppRoot } from './routes/app-root';
import { RouteError } from './routes/route-error';

/** A page loaded on first visit, so the first load carries only the shell and the page it needs. */
const page = (load: () => Promise<{ Component: ComponentType }>): Pick<RouteObject, 'lazy'> => ({
  lazy: async () => ({ Component: (await load()).Component }),
});

// To add a page: put it in routes/<name>.tsx exporting `Component`, add its path to config/paths.ts, list it
// below, and give it a nav item in routes/app-root.tsx if it should appear in the navigation.
const routes: RouteObject[] = [
  {
    ErrorBoundary: RouteError,
    HydrateFallback: () => <LoadingState />,
    children: [
      { path: paths.signIn.pattern, ...page(() => import('./routes/sign-in')) },
      { path: paths.forgotPassword.pattern, ...page(() => import('./routes/forgot-password')) },
      { path: paths.resetPassword.pattern, ...page(() => import('./routes/reset-password')) },
      { path: paths.acceptInvitation.pattern, ...page(() => import('./routes/accept-invitation')) },
      {
        Component: AppRoot,
        children: [
          { index: true, ...page(() => import('./routes/fleet')) },
          { path: paths.vessel.pattern, ...page(() => import('./routes/vessel')) },
          { path: paths.vesselLogs.pattern, ...page(() => import('./routes/vessel-logs')) },
          { path: paths.vesselLogImport.pattern, ...page(() => import('./routes/vessel-logs-import')) },
          { path: paths.vesselFuelLots.pattern, ...page(() => import('./routes/vessel-fuel-lots')) },
          { path: paths.vesselCurves.pattern, ...page(() => import('./routes/vessel-curves')) },
          { path: paths.vesselRecommend.pattern, ...page(() => import('./routes/vessel-recommend')) },
          { path: paths.vesselGuideline.pattern, ...page(() => import('./routes/vessel-guideline')) },
          { path: paths.vesselPlans.pattern, ...page(() => import('./routes/vessel-plans')) },
          { path: paths.vesselRules.pattern, ...page(() => import('./routes/vessel-rules')) },
          { path: paths.vesselOverhaul.pattern, ...page(() => import('./routes/vessel-overhaul')) },
          { path: paths.fleetOverhaul.pattern, ...page(() => import('./routes/fleet-overhaul')) },
          { path: paths.adminUsers.pattern, ...page(() => import('./routes/admin-users')) },
          { path: paths.adminOutbox.pattern, ...page(() => import('./routes/admin-outbox')) },
          { path: paths.adminSettings.pattern, ...page(() => import('./routes/admin-settings')) },
          { path: paths.audit.pattern, ...page(() => import('./routes/audit')) },
          { path: paths.vesselSavings.pattern, ...page(() => import('./routes/savings')) },
          { path: paths.vesselReport.pattern, ...page(() => import('./routes/report-vessel')) },
          { path: paths.fleetBenchmark.pattern, ...page(() => import('./routes/fleet-benchmark')) },
          { path: paths.fleetReport.pattern, ...page(() => import('./routes/report-fleet')) },
          { path: paths.subscriptions.pattern, ...page(() => import('./routes/subscriptions')) },
          { path: paths.adminFuelPrices.pattern, ...page(() => import('./routes/admin-fuel-prices')) },
          { path: '*', ...page(() => import('./routes/not-found')) },
        ],
      },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
