import { Suspense, useState } from 'react';
import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import { LogIn, LogOut, Menu, X } from 'lucide-react';
import { useMe } from '@/features/auth/api/get-me';
import { useLogout } from '@/features/auth/api/logout';
import { Loading } from '../ui/spinner';
import { cn } from '../ui/cn';
import { Logo } from './logo';
import { navItems } from './nav-items';

const roleWords = { volunteer: 'Maker', organiser: 'Organiser', coordinator: 'Coordinator' } as const;

export function AppShell() {
  const { data: user } = useMe();
  const logout = useLogout();
  const navigate = useNavigate();
  const [open, setOpen] = useState(false);
  const items = user ? navItems.filter((i) => i.roles.includes(user.role)) : [{ to: '/planner', label: 'Planner', icon: navItems[1].icon, roles: [] }];

  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-4 focus:top-4 focus:z-50 focus:rounded-lg focus:bg-white focus:p-3">
        Skip to content
      </a>
      <header className="no-print border-b border-oat-200 bg-white">
        <div className="mx-auto flex max-w-6xl items-center gap-2 px-4 py-3 sm:gap-4">
          <Link to={user ? '/home' : '/'} className="flex items-center gap-2 text-2xl font-bold text-heather-800 no-underline">
            <Logo />
            Kindloop
          </Link>
          <div className="ml-auto flex items-center gap-2 sm:gap-3">
            {user ? (
              <>
                <span className="hidden text-right text-sm leading-tight sm:block" data-testid="whoami">
                  <span className="block font-bold">{user.name}</span>
                  <span className="text-ink-soft">{roleWords[user.role]}</span>
                </span>
                <button
                  type="button"
                  className="flex min-h-11 items-center gap-2 whitespace-nowrap rounded-xl border-2 border-oat-300 px-3 py-2 font-bold hover:bg-oat-100"
                  onClick={() => logout.mutate(undefined, { onSuccess: () => navigate('/') })}
                >
                  <LogOut className="size-5" aria-hidden /> <span className="sr-only sm:not-sr-only">Sign out</span>
                </button>
              </>
            ) : (
              <Link to="/sign-in" className="flex min-h-11 items-center gap-2 whitespace-nowrap rounded-xl bg-heather-700 px-4 py-2 font-bold text-white no-underline hover:bg-heather-800 hover:text-white">
                <LogIn className="size-5" aria-hidden /> Sign in
              </Link>
            )}
            <button type="button" className="rounded-xl p-2 lg:hidden" aria-expanded={open} aria-controls="mobile-nav" aria-label="Menu" onClick={() => setOpen((o) => !o)}>
              {open ? <X className="size-7" /> : <Menu className="size-7" />}
            </button>
          </div>
        </div>
        <nav aria-label="Main" className="mx-auto hidden max-w-6xl flex-wrap gap-1 px-4 pb-2 lg:flex">
          {items.map((i) => (
            <NavLink
              key={i.to}
              to={i.to}
              end={i.to === '/home' || i.to === '/blankets'}
              className={({ isActive }) =>
                cn(
                  'flex items-center gap-2 whitespace-nowrap rounded-xl px-3 py-2 font-bold no-underline',
                  isActive ? 'bg-heather-100 text-heather-800' : 'text-ink hover:bg-oat-100 hover:text-ink',
                )
              }
            >
              <i.icon className="size-5" aria-hidden />
              {i.label}
            </NavLink>
          ))}
        </nav>
        {open && (
          <nav id="mobile-nav" aria-label="Main" className="border-t border-oat-200 px-4 py-2 lg:hidden">
            {items.map((i) => (
              <NavLink key={i.to} to={i.to} onClick={() => setOpen(false)} className="flex items-center gap-3 rounded-xl px-3 py-3 text-lg font-bold text-ink no-underline hover:bg-oat-100">
                <i.icon className="size-6" aria-hidden />
                {i.label}
              </NavLink>
            ))}
          </nav>
        )}
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
        <Suspense fallback={<Loading />}>
          <Outlet />
        </Suspense>
      </main>
      <footer className="no-print border-t border-oat-200 bg-oat-100 py-6 text-center text-sm text-ink-soft">
        Kindloop · made for community blanket drives · the receiving facility's own policy always comes first
      </footer>
    </div>
  );
}
