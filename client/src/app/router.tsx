import { createBrowserRouter, type RouteObject, type ShouldRevalidateFunction } from 'react-router';
import { queryClient, setSessionLostHandler } from '@client/lib/query-client';
import { requireAdmin, requireMe } from '@client/features/session/lib/require-session';
import { SignInPage, signInLoader } from '@client/features/session/routes/sign-in-page';
import { signInPath } from '@client/features/session/lib/return-to';
import { meQueryOptions } from '@client/features/session/api/get-me';
import { isApiError } from '@client/lib/api';
import { AppLayout } from './layout';
import { RouteError } from './route-error';
import { NotFoundPage } from './not-found';
import { HydrateFallback } from './hydrate-fallback';

/**
 * Filters and sorting live in the search string; changing them must not
 * re-run the session loaders (they would only read the cache, but each run
 * makes the navigation asynchronous and a typed filter would lag).
 */
const skipSearchOnlyChanges: ShouldRevalidateFunction = ({ currentUrl, nextUrl, formMethod, defaultShouldRevalidate }) =>
  !formMethod && currentUrl.pathname === nextUrl.pathname ? false : defaultShouldRevalidate;

export const routes: RouteObject[] = [
  {
    id: 'root',
    errorElement: <RouteError />,
    hydrateFallbackElement: <HydrateFallback />,
    children: [
      {
        path: '/signin',
        loader: signInLoader,
        Component: SignInPage,
      },
      {
        id: 'signed-in',
        loader: ({ request }) => requireMe(request),
        shouldRevalidate: skipSearchOnlyChanges,
        Component: AppLayout,
        children: [
          {
            // Errors inside a page keep the header and navigation around them.
            errorElement: <RouteError />,
            children: [
              {
                index: true,
                lazy: async () => ({
                  Component: (await import('@client/features/dashboard/routes/dashboard-page')).DashboardPage,
                }),
              },
              {
                path: 'courses',
                lazy: async () => ({
                  Component: (await import('@client/features/courses/routes/courses-page')).CoursesPage,
                }),
              },
              {
                path: 'courses/new',
                lazy: async () => ({ Component: (await import('@client/features/courses/routes/new-course-page')).NewCoursePage }),
              },
              {
                // The course page: header and tabs; each tab is a child route rendered in its <Outlet/>.
                path: 'courses/:courseId',
                shouldRevalidate: skipSearchOnlyChanges,
                lazy: async () => ({ Component: (await import('@client/features/courses/routes/course-layout')).CourseLayout }),
                children: [
                  { index: true, lazy: async () => ({ Component: (await import('@client/features/courses/routes/course-index')).CourseIndex }) },
                  { path: 'sections', lazy: async () => ({ Component: (await import('@client/features/sections/routes/sections-page')).SectionsPage }) },
                  { path: 'roster', lazy: async () => ({ Component: (await import('@client/features/roster/routes/roster-page')).RosterPage }) },
                  { path: 'roster/import', lazy: async () => ({ Component: (await import('@client/features/roster/routes/roster-import-page')).RosterImportPage }) },
                  { path: 'settings', lazy: async () => ({ Component: (await import('@client/features/courses/routes/course-settings-page')).CourseSettingsPage }) },
                  // 'exercises' (/courses/:courseId/exercises) belongs to the exercises feature: register it here, as a child.
                  { path: 'exercises', lazy: async () => ({ Component: (await import('@client/features/exercises/routes/course-exercises-page')).CourseExercisesRoute }) },
                  { path: 'exercises/new', lazy: async () => ({ Component: (await import('@client/features/exercises/routes/new-exercise-page')).NewExercisePage }) },
                ],
              },
              {
                // one exercise: the editor for staff, the brief for students
                path: 'exercises/:exerciseId',
                lazy: async () => ({ Component: (await import('@client/features/exercises/routes/exercise-page')).ExercisePage }),
              },
              {
                path: 'my/exercises',
                lazy: async () => ({
                  Component: (await import('@client/features/my-exercises/routes/my-exercises-page')).MyExercisesPage,
                }),
              },
              {
                // a student's upload page (staff: ?enrolmentId= to upload for a student)
                path: 'my/exercises/:exerciseId/upload',
                lazy: async () => ({ Component: (await import('@client/features/reports/routes/upload-page')).UploadReportPage }),
              },
              {
                path: 'reports/:reportId',
                lazy: async () => ({ Component: (await import('@client/features/reports/routes/report-page')).ReportPage }),
              },
              {
                // Reference explorer: staff only (the loader refuses students); the view lives in the search string.
                path: 'explorer',
                shouldRevalidate: skipSearchOnlyChanges,
                lazy: async () => {
                  const page = await import('@client/features/explorer/routes/explorer-page');
                  return { loader: page.explorerLoader, Component: page.ExplorerPage };
                },
              },
              {
                path: 'admin/people',
                loader: ({ request }) => requireAdmin(request),
                shouldRevalidate: skipSearchOnlyChanges,
                lazy: async () => ({ Component: (await import('@client/features/admin/routes/people-page')).PeoplePage }),
              },
              {
                path: 'admin/audit',
                loader: ({ request }) => requireAdmin(request),
                shouldRevalidate: skipSearchOnlyChanges,
                lazy: async () => ({ Component: (await import('@client/features/admin/routes/audit-page')).AuditPage }),
              },
              { path: '*', Component: NotFoundPage },
            ],
          },
        ],
      },
    ],
  },
];

export const router = createBrowserRouter(routes);

// A 401 from any query or mutation while the app is open. Ask /me whether the
// session really has ended (so that one odd 401 cannot bounce the person
// between /signin and the page forever); if it has, forget everything
// personal and go to sign-in, coming back here afterwards.
let checkingSession = false;
setSessionLostHandler(async () => {
  if (checkingSession || router.state.location.pathname === '/signin') return;
  checkingSession = true;
  try {
    await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 });
    // Still signed in: the page shows the failed request as an error.
  } catch (error) {
    if (isApiError(error) && error.status === 401) {
      const { pathname, search } = router.state.location;
      queryClient.clear();
      await router.navigate(signInPath(pathname + search), { replace: true });
    }
  } finally {
    checkingSession = false;
  }
});
