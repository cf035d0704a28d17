import { useEffect, useMemo, useRef, useState } from 'react';
import { NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { AbilityProvider } from '@casl/react';
import { useSession, useSignOut } from '../../features/auth/api/session';
import { abilityFromPackedRules } from '../../lib/ability';
import { Logo } from '../../components/ui/logo';
import { Caution } from '../../components/ui/caution';
import { Loading } from '../../components/ui/states';
import { ROLE_LABELS } from '../../../shared/roles';
import { NAV_ITEMS } from '../nav-items';
import { Dialog } from '../../components/ui/dialog';
import { PasswordChangeForm } from '../../features/auth/components/password-change-form';

/** The user menu: opening it moves focus to its first item; Escape or a click elsewhere closes it, Escape returning focus to the button. */
function UserMenu({ name, roles, area }: { name: string; roles: string; area: string | null }) {
  const [open, setOpen] = useState(false);
  const [changing, setChanging] = useState(false);
  const signOut = useSignOut();
  const navigate = useNavigate();
  const button = useRef<HTMLButtonElement>(null);
  const menu = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    menu.current?.querySelector<HTMLElement>('[role="menuitem"]')?.focus();
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setOpen(false);
      button.current?.focus();
    };
    const onPointer = (event: PointerEvent) => {
      if (!menu.current?.contains(event.target as Node) && !button.current?.contains(event.target as Node)) setOpen(false);
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('pointerdown', onPointer);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('pointerdown', onPointer);
    };
  }, [open]);
  return (
    <div className="relative">
      <button
        ref={button}
        type="button"
        className="flex items-center gap-2 rounded-md px-2 py-1 text-left text-sm text-white hover:bg-white/10"
        aria-haspopup="menu"
        aria-expanded={open}
        onClick={() => setOpen((value) => !value)}
      >
        <span className="flex h-8 w-8 items-center justify-center rounded-full bg-copper-deep font-bold text-white" aria-hidden="true">
          {name
            .split(' ')
            .map((part) => part[0])
            .join('')
            .slice(0, 2)}
        </span>
        <span className="hidden sm:block">
          <span className="block font-bold">{name}</span>
          <span className="block text-xs text-white/70">{roles}</span>
        </span>
      </button>
      {open && (
        <div ref={menu} role="menu" aria-label="Your account" className="absolute right-0 z-20 mt-2 w-60 rounded-lg border border-ink/10 bg-white p-2 text-sm text-ink shadow-lg">
          <p className="px-2 py-1 text-xs text-ink-soft">{area ? `Area: ${area}` : 'No production area'}</p>
          <button
            type="button"
            role="menuitem"
            className="w-full rounded-md px-2 py-1.5 text-left hover:bg-paper"
            onClick={() => {
              setOpen(false);
              setChanging(true);
            }}
          >
            Change password
          </button>
          <button
            type="button"
            role="menuitem"
            className="w-full rounded-md px-2 py-1.5 text-left font-bold hover:bg-paper"
            onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
          >
            {signOut.isPending ? 'Signing out…' : 'Sign out'}
          </button>
        </div>
      )}
      <Dialog open={changing} title="Change your password" onClose={() => setChanging(false)}>
        <PasswordChangeForm onDone={() => setChanging(false)} onCancel={() => setChanging(false)} />
      </Dialog>
    </div>
  );
}

/** After an administrator set this person's password, nothing else opens until they choose their own. */
function ChooseOwnPassword({ name }: { name: string }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <main className="flex min-h-screen items-center justify-center bg-ink px-4">
      <div className="w-full max-w-md rounded-2xl bg-paper p-8 shadow-xl">
        <h1 className="mb-2 text-xl font-bold">Choose your own password</h1>
        <p className="mb-4 text-sm text-ink-soft">
          {name}, an administrator set the password you signed in with, so they know it. Choose one only you know before you go on.
        </p>
        <PasswordChangeForm onDone={() => navigate('/', { replace: true })} />
        <button
          type="button"
          className="mt-4 text-sm font-bold text-ink-soft underline"
          onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
        >
          Sign out instead
        </button>
      </div>
    </main>
  );
}

/**
 * After a page change, focus moves to the new page's main heading (so a screen
 * reader announces it and Tab starts from the content), not left on the link.
 */
function useFocusHeadingOnPageChange() {
  const { pathname } = useLocation();
  // The path this layout last saw: a fresh load (or a remount) focuses nothing, a change of page does.
  const previous = useRef(pathname);
  useEffect(() => {
    if (previous.current === pathname) return;
    previous.current = pathname;
    // Routes load lazily: wait for the heading to appear, for a short while.
    let tries = 0;
    const timer = window.setInterval(() => {
      const heading = document.querySelector<HTMLElement>('main h1');
      tries += 1;
      if (heading || tries > 40) window.clearInterval(timer);
      if (!heading) return;
      heading.tabIndex = -1;
      heading.focus({ preventScroll: false });
    }, 50);
    return () => window.clearInterval(timer);
  }, [pathname]);
}

export function Component() {
  useFocusHeadingOnPageChange();
  const session = useSession();
  const ability = useMemo(() => abilityFromPackedRules(session.data?.rules ?? []), [session.data?.rules]);
  if (!session.data) return <Loading what="Checking your session" />;
  const { user } = session.data;
  if (user.passwordChangeRequired) return <ChooseOwnPassword name={user.displayName} />;
  const items = NAV_ITEMS.filter((item) => !item.visible || item.visible(ability));

  return (
    <AbilityProvider value={ability}>
      <div className="flex min-h-screen flex-col">
        <a
          href="#main-content"
          className="sr-only z-50 rounded-md bg-white px-3 py-2 font-bold text-ink focus:not-sr-only focus:fixed focus:left-2 focus:top-2"
        >
          Skip to the main content
        </a>
        <header className="bg-ink">
          <div className="mx-auto flex max-w-7xl items-center justify-between gap-4 px-4 py-2">
            <NavLink to="/" className="flex items-center gap-2 text-lg font-bold text-white">
              <Logo />
              Whorl
            </NavLink>
            <UserMenu name={user.displayName} roles={user.roles.map((role) => ROLE_LABELS[role]).join(', ')} area={user.areaName} />
          </div>
          <nav aria-label="Sections" className="mx-auto max-w-7xl overflow-x-auto px-2">
            <ul className="flex gap-1">
              {items.map((item) => (
                <li key={item.to}>
                  <NavLink
                    to={item.to}
                    end={item.to === '/'}
                    className={({ isActive }) =>
                      `block whitespace-nowrap rounded-t-md px-3 py-2 text-sm font-bold ${isActive ? 'bg-paper text-ink' : 'text-white/80 hover:text-white'}`
                    }
                  >
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
        </header>
        <main id="main-content" tabIndex={-1} className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 focus:outline-none">
          <Outlet />
        </main>
        <footer className="border-t border-ink/10 bg-white">
          <div className="mx-auto max-w-7xl px-4 py-3">
            <Caution compact />
          </div>
        </footer>
      </div>
    </AbilityProvider>
  );
}
