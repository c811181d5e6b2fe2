import { NavLink, Outlet, useLocation, useNavigate } from 'react-router';
import { useSignOut } from '../api/auth';
import type { Me } from '../api/types';
import { isAdmin } from '../lib/permissions';
import { roleSummary } from '../lib/format';
import { Button } from './Button';
import { CautionFooter } from './CautionFooter';
import { RequireAuth } from './RequireAuth';
import { MeContext } from './meContext';

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-1.5 font-semibold no-underline ${
    isActive ? 'bg-accent-50 text-accent-800' : 'text-stone-700 hover:bg-stone-100 hover:text-stone-900'
  }`;

function TopBar({ me }: { me: Me }) {
  const navigate = useNavigate();
  const { pathname } = useLocation();
  // Every page of a project's work (lines, models, runs, inversions, reports) lives under "Projects".
  const inProjects = pathname === '/' || /^\/(projects|lines|models|runs|reports)\//.test(pathname);
  const signOut = useSignOut(() => navigate('/signin', { replace: true }));
  return (
    <header className="border-b border-stone-200 bg-white">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-8 gap-y-3 px-4 py-3 sm:px-6">
        <NavLink to="/" className="text-xl font-bold tracking-tight text-stone-900 no-underline hover:text-accent-800">
          Timefield
        </NavLink>
        <nav aria-label="Main" className="order-last flex w-full flex-wrap gap-1 sm:order-none sm:w-auto">
          <NavLink to="/" end className={() => navClass({ isActive: inProjects })}>
            Projects
          </NavLink>
          {isAdmin(me) && (
            <NavLink to="/admin/accounts" className={navClass}>
              Accounts
            </NavLink>
          )}
          {isAdmin(me) && (
            <NavLink to="/admin/organisation" className={navClass}>
              Organisation
            </NavLink>
          )}
          {isAdmin(me) && (
            <NavLink to="/admin/outbox" className={navClass}>
              Mail outbox
            </NavLink>
          )}
        </nav>
        <div data-testid="user-menu" className="ml-auto flex items-center gap-4">
          <div className="text-right leading-tight">
            <p data-testid="user-name" className="font-semibold text-stone-900">
              <NavLink to="/account" title="Your account and password" className="text-stone-900 no-underline hover:text-accent-800 hover:underline">
                {me.name}
              </NavLink>
            </p>
            <p data-testid="user-roles" className="text-sm text-stone-600">
              {roleSummary(me)}
            </p>
          </div>
          <Button
            variant="secondary"
            size="sm"
            data-testid="signout"
            busy={signOut.isPending}
            busyLabel="Signing out…"
            onClick={() => signOut.mutate()}
          >
            Sign out
          </Button>
        </div>
      </div>
    </header>
  );
}

/** Everything a signed-in user sees around a page: top bar, the page, the caution line. */
export function AppShell() {
  return (
    <RequireAuth>
      {(me) => (
        <MeContext value={me}>
          <div className="flex min-h-screen flex-col">
            <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-white focus:p-2">
              Skip to content
            </a>
            <TopBar me={me} />
            <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-8 sm:px-6 sm:py-10">
              <Outlet />
            </main>
            <CautionFooter />
          </div>
        </MeContext>
      )}
    </RequireAuth>
  );
}
