import { Form, Link, NavLink, useLocation } from "react-router";
import { NAV_BY_ROLE, PUBLIC_NAV } from "~/auth/navigation";
import { ROLE_LABELS, type Role } from "~/auth/roles";
import { Logo } from "./logo";

export interface ShellUser {
  name: string;
  role: Role;
  organisationName: string;
}

export function AppShell({ user, toast, children }: { user: ShellUser | null; toast: string | null; children: React.ReactNode }) {
  const items = [...(user ? NAV_BY_ROLE[user.role] : []), ...PUBLIC_NAV];
  // The phone menu closes on every page change: a new key mounts it closed.
  const { pathname } = useLocation();
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-white focus:p-2">
        Skip to content
      </a>
      <header className="relative bg-ink-900 text-white">
        <div className="mx-auto flex max-w-6xl items-center gap-x-6 gap-y-2 px-4 py-3">
          <Link to="/" className="flex items-center gap-2 font-bold tracking-tight">
            <Logo />
            <span className="text-lg">Tenderflow</span>
          </Link>
          {/* Wide screens: the menu in one row. */}
          <nav aria-label="Main" className="hidden flex-1 flex-wrap gap-1 lg:flex">
            <NavItems items={items} />
          </nav>
          <div className="hidden lg:block">
            <Account user={user} />
          </div>
          {/* Phones and tablets: one button opens the menu (a disclosure, so it works without JavaScript too). */}
          <details key={pathname} className="group ml-auto lg:hidden">
            <summary className="flex cursor-pointer list-none items-center gap-2 rounded-md px-3 py-1.5 text-sm font-semibold text-ink-100 ring-1 ring-ink-600 hover:bg-ink-800 [&::-webkit-details-marker]:hidden">
              <span aria-hidden="true" className="text-base leading-none">
                {"\u2630"}
              </span>
              Menu
            </summary>
            <div className="absolute inset-x-0 top-14 z-30 border-t border-ink-700 bg-ink-900 px-4 pb-4 pt-2 shadow-lg">
              <nav aria-label="Main" className="flex flex-col gap-1">
                <NavItems items={items} />
              </nav>
              <div className="mt-3 border-t border-ink-700 pt-3">
                <Account user={user} />
              </div>
            </div>
          </details>
        </div>
      </header>
      {toast ? (
        <div className="mx-auto mt-4 w-full max-w-6xl px-4">
          <div role="status" className="rounded-md bg-flow-50 px-4 py-3 text-sm font-semibold text-flow-700 ring-1 ring-flow-500/30">
            {toast}
          </div>
        </div>
      ) : null}
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
        {children}
      </main>
      <footer className="border-t border-ink-100 bg-white py-4 text-center text-xs text-ink-400">
        Tenderflow sizes preliminary circuits for quotation. Every design needs review by a qualified fluid-power engineer.
      </footer>
    </div>
  );
}

function NavItems({ items }: { items: { to: string; label: string }[] }) {
  return items.map((item) => (
    <NavLink
      key={item.to}
      to={item.to}
      className={({ isActive }) =>
        `rounded-md px-3 py-2 text-sm font-semibold lg:px-2.5 lg:py-1.5 ${isActive ? "bg-flow-600 text-white" : "text-ink-200 hover:bg-ink-800 hover:text-white"}`
      }
    >
      {item.label}
    </NavLink>
  ));
}

function Account({ user }: { user: ShellUser | null }) {
  if (!user) {
    return (
      <div className="flex gap-2 text-sm">
        <Link to="/sign-in" className="rounded-md px-3 py-1.5 font-semibold text-ink-100 hover:bg-ink-800">
          Sign in
        </Link>
        <Link to="/sign-up" className="rounded-md bg-flow-600 px-3 py-1.5 font-semibold hover:bg-flow-500">
          Create an account
        </Link>
      </div>
    );
  }
  return (
    <div className="flex items-center justify-between gap-3 text-sm">
      <Link to="/settings" className="rounded-md px-2 py-1 leading-tight hover:bg-ink-800 lg:text-right" title="Your settings">
        <span className="block font-semibold">{user.name}</span>
        <span className="block text-xs text-ink-200">
          {ROLE_LABELS[user.role]} · {user.organisationName}
        </span>
      </Link>
      <Form method="post" action="/sign-out">
        <button className="rounded-md px-3 py-1.5 font-semibold text-ink-200 ring-1 ring-ink-600 hover:bg-ink-800 hover:text-white">Sign out</button>
      </Form>
    </div>
  );
}
