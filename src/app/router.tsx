import type { ComponentType } from 'react';
import { createBrowserRouter } from 'react-router-dom';
import { AppShell } from '@/components/layout/app-shell';
import { RequireRole } from '@/components/layout/require-role';
import type { Role } from '@shared/schemas/user';
import { ErrorPage } from './routes/error-page';

type Loader = () => Promise<{ default: ComponentType }>;

/** A lazily loaded page, so maps and charts don't weigh on the first load. */
const page = (load: Loader) => ({
  lazy: async () => ({ Component: (await load()).default }),
});

/** A lazily loaded page behind sign-in; `roles` limits it further. */
const guarded = (load: Loader, roles?: Role[]) => ({
  lazy: async () => {
    const Page = (await load()).default;
    return {
      Component: () => (
        <RequireRole roles={roles}>
          <Page />
        </RequireRole>
      ),
    };
  },
});

export const routes = [
  { index: true, ...page(() => import('./routes/public/home-page')) },
  { path: 'sign-in', ...page(() => import('./routes/auth/sign-in')) },
  { path: 'register', ...page(() => import('./routes/auth/register')) },
  { path: 'forgot-password', ...page(() => import('./routes/auth/forgot-password')) },
  { path: 'reset-password', ...page(() => import('./routes/auth/reset-password')) },
  { path: 'home', ...guarded(() => import('./routes/home/dashboard')) },
  { path: 'drive', ...guarded(() => import('./routes/home/drive-glance'), ['organiser', 'coordinator']) },
  { path: 'people', ...guarded(() => import('./routes/coordinator/people'), ['coordinator']) },
  { path: 'mail', ...guarded(() => import('./routes/coordinator/mail'), ['coordinator']) },
  { path: 'recipients', ...guarded(() => import('./routes/coordinator/recipients'), ['organiser', 'coordinator']) },
  { path: 'recipients/new', ...guarded(() => import('./routes/coordinator/recipients-new'), ['organiser', 'coordinator']) },
  { path: 'recipients/:id', ...guarded(() => import('./routes/coordinator/recipients-detail'), ['organiser', 'coordinator']) },
  { path: 'sites', ...guarded(() => import('./routes/coordinator/sites'), ['coordinator']) },
  { path: 'organiser/intake', ...guarded(() => import('./routes/organiser/intake'), ['organiser', 'coordinator']) },
  { path: 'organiser/assign', ...guarded(() => import('./routes/organiser/assign-board'), ['organiser', 'coordinator']) },
  { path: 'organiser/queue', ...guarded(() => import('./routes/organiser/intake-queue'), ['organiser', 'coordinator']) },
  { path: 'tags', ...guarded(() => import('./routes/organiser/tag-sheet')) },
  { path: 'planner', ...page(() => import('./routes/planner/planner-page')) },
  { path: 'needs', ...guarded(() => import('./routes/volunteer/needs')) },
  { path: 'pledges', ...guarded(() => import('./routes/volunteer/my-pledges')) },
  { path: 'blankets', ...guarded(() => import('./routes/volunteer/my-blankets')) },
  { path: 'blankets/new', ...guarded(() => import('./routes/volunteer/log-blanket')) },
  { path: 'blankets/:id', ...guarded(() => import('./routes/volunteer/blanket-detail')) },
  { path: 'drop-off', ...guarded(() => import('./routes/volunteer/drop-off')) },
  { path: 'organiser/drop-offs', ...guarded(() => import('./routes/organiser/drop-off-day'), ['organiser', 'coordinator']) },
  { path: 'blankets/:id/edit', ...guarded(() => import('./routes/volunteer/edit-blanket')) },
  { path: 'all-blankets', ...guarded(() => import('./routes/organiser/all-blankets'), ['organiser', 'coordinator']) },
  { path: 'all-pledges', ...guarded(() => import('./routes/organiser/all-pledges'), ['organiser', 'coordinator']) },
  { path: 'runs', ...guarded(() => import('./routes/delivery/runs'), ['organiser', 'coordinator']) },
  { path: 'runs/:id', ...guarded(() => import('./routes/delivery/run-detail'), ['organiser', 'coordinator']) },
  { path: 'runs/:id/packing-sheet', ...guarded(() => import('./routes/delivery/packing-sheet'), ['organiser', 'coordinator']) },
  { path: 'exports', ...guarded(() => import('./routes/delivery/exports'), ['organiser', 'coordinator']) },
  // Feature pages are added above this line.
  { path: '*', ...page(() => import('./routes/not-found')) },
];

export const router = createBrowserRouter([{ path: '/', element: <AppShell />, errorElement: <ErrorPage />, children: routes }]);
