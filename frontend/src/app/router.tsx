import { createBrowserRouter, Navigate } from 'react-router-dom';
import { RequireAdmin } from './guards/require-admin';
import { Loading } from '@/components/ui/loading';
import { RequireAuth } from './guards/require-auth';
import { RootLayout } from './layout/root-layout';
import { AccountRoute } from './routes/account';
import { AdminMailMessageRoute, AdminMailRoute, NoMessageSelected } from './routes/admin-mail';
import { AdminUsersRoute } from './routes/admin-users';
import { CampaignRoute } from './routes/campaign';
import { CampaignSpectraRoute } from './routes/campaign-spectra';
import { CampaignTargetsRoute } from './routes/campaign-targets';
import { CampaignUploadRoute } from './routes/campaign-upload';
import { CampaignsRoute } from './routes/campaigns';
import { InvitationRoute } from './routes/invitation';
import { NotFoundRoute } from './routes/not-found';
import { RouteError } from './routes/route-error';
import { SignInRoute } from './routes/sign-in';

// Shown while the lazily loaded inspection code arrives on a first visit straight to its URL.
const inspectFallback = <Loading label="Loading the inspection screen…" />;
const pageFallback = <Loading label="Loading the page…" />;

export const createRouter = () =>
  createBrowserRouter([
    {
      element: <RootLayout />,
      errorElement: <RouteError />,
      children: [
        { path: '/sign-in', element: <SignInRoute /> },
        { path: '/invitations/:token', element: <InvitationRoute /> },
        {
          element: <RequireAuth />,
          children: [
            { path: '/', element: <Navigate to="/campaigns" replace /> },
            { path: '/campaigns', element: <CampaignsRoute /> },
            { path: '/campaigns/:campaignId', element: <CampaignRoute /> },
            { path: '/campaigns/:campaignId/upload', element: <CampaignUploadRoute /> },
            { path: '/campaigns/:campaignId/targets', element: <CampaignTargetsRoute /> },
            { path: '/campaigns/:campaignId/spectra', element: <CampaignSpectraRoute /> },
            // The inspection screen and its plotting library load only when a reader opens it.
            {
              path: '/campaigns/:campaignId/inspect',
              lazy: () => import('./routes/campaign-inspect').then((m) => ({ Component: m.CampaignInspectRoute })),
              hydrateFallbackElement: inspectFallback,
            },
            {
              path: '/spectra/:spectrumId',
              lazy: () => import('./routes/spectrum').then((m) => ({ Component: m.SpectrumRoute })),
              hydrateFallbackElement: inspectFallback,
            },
            // The release pages (assignment, settlement, confirmed table, families) are used by few people, rarely: loaded on demand.
            {
              path: '/campaigns/:campaignId/assign',
              lazy: () => import('./routes/campaign-assign').then((m) => ({ Component: m.CampaignAssignRoute })),
              hydrateFallbackElement: pageFallback,
            },
            {
              path: '/campaigns/:campaignId/disagreements',
              lazy: () => import('./routes/campaign-disagreements').then((m) => ({ Component: m.CampaignDisagreementsRoute })),
              hydrateFallbackElement: pageFallback,
            },
            {
              path: '/campaigns/:campaignId/confirmed',
              lazy: () => import('./routes/campaign-confirmed').then((m) => ({ Component: m.CampaignConfirmedRoute })),
              hydrateFallbackElement: pageFallback,
            },
            {
              path: '/campaigns/:campaignId/families',
              lazy: () => import('./routes/campaign-families').then((m) => ({ Component: m.CampaignFamiliesRoute })),
              hydrateFallbackElement: pageFallback,
            },
            { path: '/account', element: <AccountRoute /> },
            {
              path: '/admin',
              element: <RequireAdmin />,
              children: [
                { index: true, element: <Navigate to="/admin/users" replace /> },
                { path: 'users', element: <AdminUsersRoute /> },
                {
                  path: 'mail',
                  element: <AdminMailRoute />,
                  children: [
                    { index: true, element: <NoMessageSelected /> },
                    { path: ':messageId', element: <AdminMailMessageRoute /> },
                  ],
                },
              ],
            },
          ],
        },
        { path: '*', element: <NotFoundRoute /> },
      ],
    },
  ]);
