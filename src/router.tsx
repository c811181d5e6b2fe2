import { createBrowserRouter } from 'react-router';
import { AppShell } from './components/AppShell';
import { Loading } from './components/LoadState';
import { AccountsPage } from './routes/AccountsPage';
import { LinePage } from './routes/LinePage';
import { MyAccountPage } from './routes/MyAccountPage';
import { NotFoundPage } from './routes/NotFoundPage';
import { ProjectPage } from './routes/ProjectPage';
import { ProjectsPage } from './routes/ProjectsPage';
import { RouteErrorPage } from './routes/RouteErrorPage';
import { SignInPage } from './routes/SignInPage';
import { ResetPasswordPage } from './routes/ResetPasswordPage';

/** Shown while a lazily loaded run page arrives on a first visit straight to its address. */
const runPageLoading = <Loading what="page" />;

const modelEditorLoading = <Loading what="model editor" />;
const loadModelEditor = () => import('./routes/ModelEditorPage').then((m) => ({ Component: m.ModelEditorPage }));

/** Every page of the client. Pages inside the shell require a signed-in user. */
export const router = createBrowserRouter([
  { path: '/signin', element: <SignInPage />, errorElement: <RouteErrorPage /> },
  { path: '/reset-password', element: <ResetPasswordPage />, errorElement: <RouteErrorPage /> },
  {
    element: <AppShell />,
    errorElement: <RouteErrorPage />,
    children: [
      {
        // A pathless layer so that a page error keeps the top bar and footer around it.
        errorElement: <RouteErrorPage insideShell />,
        children: [
          { index: true, element: <ProjectsPage /> },
          { path: 'projects/:projectId', element: <ProjectPage /> },
          { path: 'lines/:lineId', element: <LinePage /> },
          // The model editor (canvas section, preview worker) loads in its own chunk on first visit.
          { path: 'lines/:lineId/models/new', hydrateFallbackElement: modelEditorLoading, lazy: loadModelEditor },
          { path: 'models/:modelId', hydrateFallbackElement: modelEditorLoading, lazy: loadModelEditor },
          // Run pages load on first visit: they carry the chart code, which most visits never need.
          { path: 'lines/:lineId/runs', hydrateFallbackElement: runPageLoading, lazy: async () => ({ Component: (await import('./routes/LineRunsPage')).LineRunsPage }) },
          { path: 'runs/:runId', hydrateFallbackElement: runPageLoading, lazy: async () => ({ Component: (await import('./routes/RunPage')).RunPage }) },
          { path: 'runs/:runId/compare/:otherRunId', hydrateFallbackElement: runPageLoading, lazy: async () => ({ Component: (await import('./routes/RunComparePage')).RunComparePage }) },
          // Inversion pages (issue 11) carry the section and chart code: their own chunks, loaded on first visit.
          { path: 'lines/:lineId/inversions/:inversionId', hydrateFallbackElement: runPageLoading, lazy: async () => ({ Component: (await import('./routes/InversionPage')).InversionPage }) },
          { path: 'lines/:lineId/inversions/:inversionId/compare', hydrateFallbackElement: runPageLoading, lazy: async () => ({ Component: (await import('./routes/InversionComparePage')).InversionComparePage }) },
          { path: 'lines/:lineId/ensembles/:ensembleId', hydrateFallbackElement: runPageLoading, lazy: async () => ({ Component: (await import('./routes/EnsemblePage')).EnsemblePage }) },
          // First-break picking on field records: the canvas and trace processing load on first visit.
          { path: 'lines/:lineId/picking', hydrateFallbackElement: <Loading what="records" />, lazy: async () => ({ Component: (await import('./routes/PickingPage')).PickingPage }) },
          { path: 'admin/accounts', element: <AccountsPage /> },
          { path: 'account', element: <MyAccountPage /> },
          // Reports, the mail outbox and the audit trail (issue 7), each in its own small chunk.
          { path: 'reports/:reportId', hydrateFallbackElement: <Loading what="report" />, lazy: async () => ({ Component: (await import('./routes/ReportPage')).ReportPage }) },
          { path: 'projects/:projectId/plan', hydrateFallbackElement: <Loading what="plan" />, lazy: async () => ({ Component: (await import('./routes/PlanPage')).PlanPage }) },
          { path: 'projects/:projectId/audit', hydrateFallbackElement: <Loading what="audit trail" />, lazy: async () => ({ Component: (await import('./routes/AuditPage')).AuditPage }) },
          { path: 'admin/organisation', hydrateFallbackElement: <Loading what="organisation" />, lazy: async () => ({ Component: (await import('./routes/OrganisationPage')).OrganisationPage }) },
          { path: 'admin/outbox', hydrateFallbackElement: <Loading what="outbox" />, lazy: async () => ({ Component: (await import('./routes/OutboxPage')).OutboxPage }) },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
]);
