import { Form, Link, NavLink } from "react-router";
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
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-white focus:p-2">
        Skip to content
      </a>
      <header className="bg-ink-900 text-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-8 gap-y-2 px-4 py-3">
          <Link to="/" className="flex items-center gap-2 font-bold tracking-tight">
            <Logo />
            <span className="text-lg">Tenderflow</span>
          </Link>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            {items.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  `rounded-md px-3 py-1.5 text-sm font-semibold ${isActive ? "bg-flow-600 text-white" : "text-ink-200 hover:bg-ink-800 hover:text-white"}`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          {user ? (
            <div className="flex items-center gap-3 text-sm">
              <Link to="/settings" className="rounded-md px-2 py-1 text-right leading-tight hover:bg-ink-800" title="Your settings">
                <span className="block font-semibold">{user.name}</span>
                <span className="block text-xs text-ink-200">
                  {ROLE_LABELS[user.role]} · {user.organisationName}
                </span>
              </Link>
              <Form method="post" action="/sign-out">
                <button className="rounded-md px-3 py-1.5 font-semibold text-ink-200 ring-1 ring-ink-600 hover:bg-ink-800 hover:text-white">
                  Sign out
                </button>
              </Form>
            </div>
          ) : (
            <div className="flex gap-2 text-sm">
              <Link to="/sign-in" className="rounded-md px-3 py-1.5 font-semibold text-ink-100 hover:bg-ink-800">
                Sign in
              </Link>
              <Link to="/sign-up" className="rounded-md bg-flow-600 px-3 py-1.5 font-semibold hover:bg-flow-500">
                Create an account
              </Link>
            </div>
          )}
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
