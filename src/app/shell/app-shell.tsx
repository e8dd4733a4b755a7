import { useEffect, useRef, useState } from 'react';
import { Link, Outlet, ScrollRestoration, useLocation, useNavigation } from 'react-router-dom';
import type { ActiveMe } from '../../lib/active-me.ts';
import { CloseIcon, MenuIcon, TidefieldMark } from '../../components/ui/icons.tsx';
import { paths } from '../../config/paths.ts';
import { cx } from '../../lib/class-names.ts';
import { NavMenu } from './nav-menu.tsx';
import { UserPanel } from './user-panel.tsx';

// Tailwind's `lg` breakpoint: from here on the navigation is a permanent side rail.
const WIDE = '(min-width: 64rem)';

function Brand() {
  return (
    <Link to={paths.overview.getHref()} className="flex items-center gap-2.5 rounded-md text-xl font-bold text-foam-50 no-underline">
      <TidefieldMark />
      Tidefield
    </Link>
  );
}

/**
 * The frame of every signed-in page. From 1024 px: a side rail with the navigation and a top
 * bar with the account. Below: a top bar with a menu button that opens navigation and account.
 */
export function AppShell({ me }: { me: ActiveMe }) {
  const [menuOpen, setMenuOpen] = useState(false);
  const location = useLocation();
  const navigation = useNavigation();
  const mainRef = useRef<HTMLElement>(null);
  const shownPath = useRef(location.pathname);

  // After a navigation, focus the new page so that screen readers start reading there.
  useEffect(() => {
    if (shownPath.current === location.pathname) return;
    shownPath.current = location.pathname;
    mainRef.current?.focus({ preventScroll: true });
  }, [location.pathname]);

  useEffect(() => {
    if (!menuOpen) return;
    const wide = window.matchMedia(WIDE);
    const close = () => wide.matches && setMenuOpen(false);
    const onKey = (event: KeyboardEvent) => event.key === 'Escape' && setMenuOpen(false);
    wide.addEventListener('change', close);
    window.addEventListener('keydown', onKey);
    return () => {
      wide.removeEventListener('change', close);
      window.removeEventListener('keydown', onKey);
    };
  }, [menuOpen]);

  return (
    <div className="min-h-dvh lg:grid lg:grid-cols-[16rem_minmax(0,1fr)]">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-lantern-400 px-4 py-2 font-bold text-ink-950 no-underline focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <ScrollRestoration />
      {navigation.state === 'loading' && (
        <div aria-hidden="true" className="fixed inset-x-0 top-0 z-40 h-1 animate-pulse bg-lantern-400" />
      )}

      <header className="sticky top-0 z-30 flex h-16 items-center justify-between border-b border-ink-700 bg-ink-900 px-4 lg:hidden">
        <Brand />
        <button
          type="button"
          aria-expanded={menuOpen}
          aria-controls="app-sidebar"
          onClick={() => setMenuOpen((open) => !open)}
          className="inline-flex min-h-11 items-center gap-2 rounded-md border border-ink-500 px-3 font-bold hover:bg-ink-800"
        >
          {menuOpen ? <CloseIcon /> : <MenuIcon />}
          Menu
        </button>
      </header>

      <div
        id="app-sidebar"
        className={cx(
          'flex-col border-ink-700 bg-ink-900',
          menuOpen ? 'flex' : 'hidden',
          'max-lg:fixed max-lg:inset-x-0 max-lg:top-16 max-lg:bottom-0 max-lg:z-30 max-lg:overflow-y-auto',
          'lg:sticky lg:top-0 lg:flex lg:h-dvh lg:overflow-y-auto lg:border-r',
        )}
      >
        <div className="hidden h-16 shrink-0 items-center px-6 lg:flex">
          <Brand />
        </div>
        <NavMenu role={me.role} onNavigate={() => setMenuOpen(false)} />
        <div className="mt-auto lg:hidden">
          <UserPanel me={me} layout="stack" />
        </div>
      </div>

      <div className="flex min-w-0 flex-col">
        <header className="sticky top-0 z-20 hidden h-16 items-center border-b border-ink-700 bg-ink-950 px-8 lg:flex">
          <UserPanel me={me} layout="bar" />
        </header>
        <main
          id="main"
          ref={mainRef}
          tabIndex={-1}
          inert={menuOpen || undefined}
          className="mx-auto w-full max-w-6xl px-4 py-8 focus:outline-none sm:px-8 lg:py-10"
        >
          <Outlet />
        </main>
      </div>
    </div>
  );
}
