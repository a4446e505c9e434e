import { redirect } from "react-router";
import { Organisation, User } from "~/models/index.server";
import { oncePerRequest } from "~/http/request-scope.server";
import { forbidden } from "~/services/errors.server";
import { HOME_BY_ROLE, type Role } from "./roles";
import { getSessionUserId, hasSessionCookie, signOutRedirect } from "./session.server";

export type SignedInUser = User & { organisation: Organisation };

const OWN_BASE = "http://tenderflow.invalid";

/**
 * Only our own paths are followed after sign-in (no open redirects). The address is judged as
 * a browser reads it: control characters (which browsers drop, so `/<TAB>/host` becomes
 * `//host`) and backslashes (read as slashes) are refused outright, and what is left must
 * parse to our own origin. The path returned is the parsed one, safe in a Location header.
 */
export function safeRedirect(to: FormDataEntryValue | string | null | undefined, fallback = "/") {
  if (typeof to !== "string" || !to.startsWith("/") || to.length > 2_000) return fallback;
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f\\]/.test(to)) return fallback;
  let url: URL;
  try {
    url = new URL(to, OWN_BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== OWN_BASE) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  return path.startsWith("//") ? fallback : path;
}

/**
 * The one place a request becomes a user: the session row must be live (not signed out,
 * revoked, idle too long or too old, see session.server.ts) and its user active.
 */
export function getOptionalUser(request: Request): Promise<SignedInUser | null> {
  // The root loader and the page's loaders ask for the same request's user: look it up once.
  return oncePerRequest(SIGNED_IN_USER, request, () => lookUpUser(request));
}

const SIGNED_IN_USER = Symbol("signed-in user");

async function lookUpUser(request: Request): Promise<SignedInUser | null> {
  const userId = await getSessionUserId(request);
  if (!userId) return null;
  const user = await User.findByPk(userId, { include: [{ model: Organisation, as: "organisation" }] });
  return user && user.active ? (user as SignedInUser) : null;
}

/** The signed-in, active user, or a redirect to sign-in that comes back here afterwards. */
export async function requireUser(request: Request): Promise<SignedInUser> {
  const user = await getOptionalUser(request);
  if (user) return user;
  const url = new URL(request.url);
  const back = `${url.pathname}${url.search}`;
  const to = `/sign-in?redirectTo=${encodeURIComponent(back)}`;
  // An ended session, or one naming a deactivated or deleted user, is dropped, not kept.
  if (await hasSessionCookie(request)) throw await signOutRedirect(request, to);
  throw redirect(to);
}

/** The signed-in user if their role is one of `roles`; a 403 page otherwise. */
export async function requireRole(request: Request, roles: readonly Role[]): Promise<SignedInUser> {
  const user = await requireUser(request);
  if (!roles.includes(user.role)) forbidden();
  return user;
}

/** Sign-in and sign-up pages send a signed-in user to their home instead. */
export async function requireAnonymous(request: Request) {
  const user = await getOptionalUser(request);
  if (user) throw redirect(HOME_BY_ROLE[user.role]);
}
