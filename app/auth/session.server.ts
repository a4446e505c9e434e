import { createCookieSessionStorage, redirect } from "react-router";
import { env } from "~/env.server";

type SessionData = { userId: string };
type SessionFlash = { toast: string };

// Signed, httpOnly, SameSite=Lax: the app servers keep no session state of their own.
export const sessionStorage = createCookieSessionStorage<SessionData, SessionFlash>({
  cookie: {
    name: "__tenderflow",
    httpOnly: true,
    sameSite: "lax",
    path: "/",
    secrets: [env().SESSION_SECRET],
    secure: env().APP_URL.startsWith("https://"),
    maxAge: 60 * 60 * 24 * 14,
  },
});

export function getSession(request: Request) {
  return sessionStorage.getSession(request.headers.get("Cookie"));
}

export async function getSessionUserId(request: Request): Promise<string | undefined> {
  return (await getSession(request)).get("userId");
}

/** Starts a signed-in session and redirects, replacing whatever session the browser had. */
export async function signInRedirect(request: Request, userId: string, to: string) {
  const session = await getSession(request);
  session.set("userId", userId);
  return redirect(to, { headers: { "Set-Cookie": await sessionStorage.commitSession(session) } });
}

export async function signOutRedirect(request: Request, to = "/") {
  const session = await getSession(request);
  return redirect(to, { headers: { "Set-Cookie": await sessionStorage.destroySession(session) } });
}

/** A one-time message shown on the next page (e.g. "Invitation sent"). */
export async function redirectWithToast(request: Request, to: string, toast: string) {
  const session = await getSession(request);
  session.flash("toast", toast);
  return redirect(to, { headers: { "Set-Cookie": await sessionStorage.commitSession(session) } });
}

export async function popToast(request: Request) {
  const session = await getSession(request);
  const toast = session.get("toast") ?? null;
  return { toast, headers: toast ? { "Set-Cookie": await sessionStorage.commitSession(session) } : undefined };
}
