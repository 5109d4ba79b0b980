import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { projectSections } from '../features/projects/components/project-sections';
import { AboutRoute } from './routes/about';
import { DevMailRoute } from './routes/dev-mail';
import { InvitationRoute } from './routes/invitation';
import { MembersRoute } from './routes/members';
import { NotFoundRoute } from './routes/not-found';
import { ProjectLayoutRoute } from './routes/project-layout';
import { ProjectMembersRoute } from './routes/project-members';
import { ProjectOverviewRoute } from './routes/project-overview';
import { ProjectSectionRoute } from './routes/project-section';
import { ProjectsRoute } from './routes/projects';
import { RequireSessionRoute } from './routes/require-session';
import { RootErrorRoute, RouteError } from './routes/route-error';
import { RootLayoutRoute, RootLoading } from './routes/root-layout';
import { SignInRoute } from './routes/sign-in';
import { requireSessionLoader, rootLoader } from './session';

const section = <RouteError />;

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
          { path: 'about', element: <AboutRoute /> },
          { path: 'invitations/:token', element: <InvitationRoute /> },
          { path: 'dev/mail', element: <DevMailRoute /> },
          {
            loader: requireSessionLoader,
            element: <RequireSessionRoute />,
            children: [
              { index: true, element: <Navigate to="/projects" replace /> },
              { path: 'projects', element: <ProjectsRoute />, errorElement: section },
              {
                path: 'projects/:projectId',
                element: <ProjectLayoutRoute />,
                errorElement: section,
                children: [
                  {
                    errorElement: section,
                    children: [
                      { index: true, element: <ProjectOverviewRoute /> },
                      { path: 'members', element: <ProjectMembersRoute /> },
                      ...projectSections
                        .filter((entry) => !entry.available)
                        .map((entry) => ({ path: entry.slug, element: <ProjectSectionRoute section={entry} /> })),
                    ],
                  },
                ],
              },
              { path: 'members', element: <MembersRoute />, errorElement: section },
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
