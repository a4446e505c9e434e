// Every state-changing request must come from one of our own pages. SameSite=Lax cookies stop
// other sites, but not a form on another port of the same host (the same "site"), so the
// browser's Origin header is compared with the app's own origin, for every route at once.
import { env } from "~/env.server";

/** Callers that authenticate themselves and are never a browser tab of ours. */
const SIGNED_CALLERS = [/^\/webhooks\/stripe$/];

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export type OriginProblem = { status: 403; message: string };

function originOf(value: string): string | null {
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

/**
 * Null when the request may change state. Browsers send Origin with every POST; where an old
 * one does not, Sec-Fetch-Site or the Referer says where the form was. A request with none of
 * them is not a browser's, so it carries no one's session by accident and is let through.
 */
export function checkSameOrigin(request: Request): OriginProblem | null {
  if (SAFE_METHODS.has(request.method)) return null;
  const url = new URL(request.url);
  if (SIGNED_CALLERS.some((path) => path.test(url.pathname))) return null;
  const ours = new URL(env().APP_URL).origin;
  const origin = request.headers.get("Origin");
  if (origin !== null) return origin === ours ? null : refuse(origin === "null" ? "a page with no address" : origin, ours);
  const fetchSite = request.headers.get("Sec-Fetch-Site");
  if (fetchSite !== null) return fetchSite === "same-origin" || fetchSite === "none" ? null : refuse(`another site (${fetchSite})`, ours);
  const referer = request.headers.get("Referer");
  if (referer !== null) {
    const from = originOf(referer);
    return from === ours ? null : refuse(from ?? "an unknown page", ours);
  }
  return null;
}

function refuse(from: string, ours: string): OriginProblem {
  if (from.length > 100) from = `${from.slice(0, 97)}…`;
  return {
    status: 403,
    message: `This form was sent from ${from}, not from ${ours}. Nothing was changed: open the page on ${ours} and try again.`,
  };
}
