// The headers every response carries, set in one place (the root middleware). The app loads
// nothing from outside, so the content security policy allows only its own origin, plus the
// per-request nonce for the scripts React Router writes inline.
import { randomBytes } from "node:crypto";
import { env } from "~/env.server";

/** Under the Vite dev server the policy is looser: no nonce, and Vite's own inline scripts run. */
const underDevServer = () => env().NODE_ENV === "development";

/** A nonce for one response's inline scripts; none under the dev server. */
export const newNonce = () => (underDevServer() ? "" : randomBytes(16).toString("base64"));

/** Where the card service's payment page lives: the pay form's redirect goes there. */
function checkoutOrigin() {
  const { STRIPE_API_URL } = env();
  return STRIPE_API_URL ? new URL(STRIPE_API_URL).origin : "https://checkout.stripe.com";
}

export function contentSecurityPolicy(nonce: string, dev = underDevServer()) {
  return [
    "default-src 'self'",
    // The nonced inline scripts import the route modules, which 'self' allows.
    // Under the Vite dev server there is no nonce (React would warn that the browser hid it
    // before hydration) and Vite's own inline scripts run.
    dev ? "script-src 'self' 'unsafe-inline'" : `script-src 'self' 'nonce-${nonce}'`,
    // Tailwind's stylesheet is a file; a few components set widths and colours in style="".
    dev ? "style-src 'self' 'unsafe-inline'" : "style-src 'self'; style-src-attr 'unsafe-inline'",
    "img-src 'self' data:",
    // Vite inlines the smallest font subsets as data: URLs.
    "font-src 'self' data:",
    `connect-src 'self'${dev ? " ws:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    `form-action 'self' ${checkoutOrigin()}`,
    "frame-ancestors 'none'",
  ].join("; ");
}

/**
 * Adds the security headers to a response. A header the route set itself stands (a stored
 * file's download carries its own stricter CSP, `default-src 'none'; sandbox`); ours fill in
 * what it left out. Nothing answered to a request that carried a cookie (a session) is kept by
 * shared or browser caches; a route's own Cache-Control stands only for anonymous requests.
 */
export function applySecurityHeaders(response: Response, { nonce, withCookie }: { nonce: string; withCookie: boolean }) {
  const headers = response.headers;
  const ours: [string, string][] = [
    ["Content-Security-Policy", contentSecurityPolicy(nonce)],
    ["X-Content-Type-Options", "nosniff"],
    ["X-Frame-Options", "DENY"],
    ["Referrer-Policy", "same-origin"],
    ["Cross-Origin-Opener-Policy", "same-origin"],
    ["Permissions-Policy", "camera=(), microphone=(), geolocation=(), payment=()"],
  ];
  if (env().APP_URL.startsWith("https://")) ours.push(["Strict-Transport-Security", "max-age=31536000; includeSubDomains"]);
  for (const [name, value] of ours) if (!headers.has(name)) headers.set(name, value);
  if (withCookie || !headers.has("Cache-Control")) headers.set("Cache-Control", "private, no-store");
  return response;
}
