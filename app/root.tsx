import { Links, Meta, Outlet, Scripts, ScrollRestoration, data, isRouteErrorResponse, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/root";
import "./app.css";
import { getOptionalUser } from "~/auth/permissions.server";
import { popToast } from "~/auth/session.server";
import { AppShell } from "~/components/app-shell";
import { ErrorPage } from "~/components/error-page";
import { rootMiddleware } from "~/http/middleware.server";

export const meta: Route.MetaFunction = () => [{ title: "Tenderflow" }];

// The mark from the header, served from public/.
export const links: Route.LinksFunction = () => [{ rel: "icon", href: "/favicon.svg", type: "image/svg+xml" }];

// Origin check, request bounds and security headers, for every route below the root.
export const middleware: Route.MiddlewareFunction[] = rootMiddleware;

export async function loader({ request }: Route.LoaderArgs) {
  const [user, { toast, headers }] = await Promise.all([getOptionalUser(request), popToast(request)]);
  return data(
    {
      user: user && {
        id: user.id,
        name: user.name,
        email: user.email,
        role: user.role,
        unitSystem: user.unitSystem,
        organisationName: user.organisation.name,
      },
      toast,
    },
    { headers },
  );
}

export function Layout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen font-sans">
        {children}
        <ScrollRestoration />
        <Scripts />
      </body>
    </html>
  );
}

export default function App({ loaderData }: Route.ComponentProps) {
  return (
    <AppShell user={loaderData.user} toast={loaderData.toast}>
      <Outlet />
    </AppShell>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  // The shell stays when the root loader succeeded, so the navigation is still there.
  const root = useRouteLoaderData<typeof loader>("root");
  let page = <ErrorPage status={500} />;
  if (isRouteErrorResponse(error)) {
    const message = typeof error.data?.message === "string" ? error.data.message : undefined;
    page = <ErrorPage status={error.status} message={message} />;
  } else if (import.meta.env.DEV && error instanceof Error) {
    page = <ErrorPage status={500} message={error.message} detail={error.stack} />;
  }
  return (
    <AppShell user={root?.user ?? null} toast={null}>
      {page}
    </AppShell>
  );
}
