import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { projectSections } from '../features/projects/components/project-sections';
import { NotFoundRoute } from './routes/not-found';
import { ProjectsRoute } from './routes/projects';
import { RequireSessionRoute } from './routes/require-session';
import { RootErrorRoute, RouteError } from './routes/route-error';
import { RootLayoutRoute, RootLoading } from './routes/root-layout';
import { SignInRoute } from './routes/sign-in';
import { requireSessionLoader, rootLoader, whenSignedIn } from './session';

const section = <RouteError />;

// Pages off the first path (sign-in → projects) load on demand, each in its own chunk. Their loaders prefetch only
// for a signed-in person (`whenSignedIn`).
const about = () => import('./routes/about').then((module) => ({ Component: module.AboutRoute }));
const devMail = () => import('./routes/dev-mail').then((module) => ({ Component: module.DevMailRoute }));
const invitation = () => import('./routes/invitation').then((module) => ({ Component: module.InvitationRoute }));
const members = () => import('./routes/members').then((module) => ({ Component: module.MembersRoute }));
const projectLayout = () => import('./routes/project-layout').then((module) => ({ Component: module.ProjectLayoutRoute }));
const projectOverview = () => import('./routes/project-overview').then((module) => ({ Component: module.ProjectOverviewRoute }));
const projectMembers = () => import('./routes/project-members').then((module) => ({ Component: module.ProjectMembersRoute }));
const projectStructures = () =>
  import('./routes/project-structures').then((module) => ({ Component: module.ProjectStructuresRoute, loader: whenSignedIn(module.projectStructuresLoader) }));
const projectStructure = () =>
  import('./routes/project-structure').then((module) => ({ Component: module.ProjectStructureRoute, loader: whenSignedIn(module.projectStructureLoader) }));
const projectLoadCases = () =>
  import('./routes/project-load-cases').then((module) => ({ Component: module.ProjectLoadCasesRoute, loader: whenSignedIn(module.projectLoadCasesLoader) }));
const projectComfortCriteria = () =>
  import('./routes/project-comfort-criteria').then((module) => ({
    Component: module.ProjectComfortCriteriaRoute,
    loader: whenSignedIn(module.projectComfortCriteriaLoader),
  }));
const tuningVariants = () =>
  import('./routes/tuning-variants').then((module) => ({ Component: module.TuningVariantsRoute, loader: whenSignedIn(module.tuningVariantsLoader) }));
const tuningVariant = () =>
  import('./routes/tuning-variant').then((module) => ({ Component: module.TuningVariantRoute, loader: whenSignedIn(module.tuningVariantLoader) }));
const tuningVariantEdit = () =>
  import('./routes/tuning-variant').then((module) => ({ Component: module.TuningVariantEditRoute, loader: whenSignedIn(module.tuningVariantLoader) }));
const projectSiteRecords = () =>
  import('./routes/project-site-records').then((module) => ({ Component: module.ProjectSiteRecordsRoute, loader: whenSignedIn(module.projectSiteRecordsLoader) }));
const projectSignOff = () =>
  import('./routes/project-sign-off').then((module) => ({ Component: module.ProjectSignOffRoute, loader: whenSignedIn(module.projectSignOffLoader) }));
const projectHardwareSheet = () =>
  import('./routes/project-hardware-sheet').then((module) => ({ Component: module.ProjectHardwareSheetRoute, loader: whenSignedIn(module.projectHardwareSheetLoader) }));
const projectHistory = () =>
  import('./routes/project-history').then((module) => ({ Component: module.ProjectHistoryRoute, loader: whenSignedIn(module.projectHistoryLoader) }));
const projectSection = (slug: string) => () =>
  import('./routes/project-section').then((module) => ({ Component: module.projectSectionRoute(slug) }));

export const router = createBrowserRouter([
  {
    id: 'root',
    path: '/',
    loader: rootLoader,
    element: <RootLayoutRoute />,
    errorElement: <RootErrorRoute />,
    hydrateFallbackElement: <RootLoading />,
    children: [
      {
        errorElement: section,
        children: [
          { path: 'sign-in', element: <SignInRoute /> },
          { path: 'about', lazy: about },
          { path: 'invitations/:token', lazy: invitation },
          { path: 'dev/mail', lazy: devMail },
          {
            loader: requireSessionLoader,
            element: <RequireSessionRoute />,
            children: [
              { index: true, element: <Navigate to="/projects" replace /> },
              { path: 'projects', element: <ProjectsRoute />, errorElement: section },
              {
                path: 'projects/:projectId',
                lazy: projectLayout,
                errorElement: section,
                children: [
                  {
                    errorElement: section,
                    children: [
                      { index: true, lazy: projectOverview },
                      { path: 'members', lazy: projectMembers },
                      { path: 'structures', lazy: projectStructures },
                      { path: 'structures/:structureId', lazy: projectStructure },
                      { path: 'load-cases', lazy: projectLoadCases },
                      { path: 'comfort-criteria', lazy: projectComfortCriteria },
                      { path: 'tuning-variants', lazy: tuningVariants },
                      { path: 'tuning-variants/new', lazy: tuningVariantEdit },
                      { path: 'tuning-variants/:variantId', lazy: tuningVariant },
                      { path: 'tuning-variants/:variantId/edit', lazy: tuningVariantEdit },
                      { path: 'site-records', lazy: projectSiteRecords },
                      { path: 'sign-off', lazy: projectSignOff },
                      { path: 'hardware-sheet', lazy: projectHardwareSheet },
                      { path: 'history', lazy: projectHistory },
                      ...projectSections
                        .filter((entry) => !entry.available)
                        .map((entry) => ({ path: entry.slug, lazy: projectSection(entry.slug) })),
                    ],
                  },
                ],
              },
              { path: 'members', lazy: members, errorElement: section },
            ],
          },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
