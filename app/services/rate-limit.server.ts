import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { RouterContextProvider } from "react-router";
import { getOptionalUser } from "~/auth/permissions.server";
import { clientAddressContext } from "~/http/request-context.server";
import { sequelize } from "~/db.server";
import { env } from "~/env.server";

// Counters live in PostgreSQL, so every app server behind a load balancer shares them.
let limiter: RateLimiterPostgres | undefined;
function sizingLimiter() {
  limiter ??= new RateLimiterPostgres({
    storeClient: sequelize,
    storeType: "sequelize",
    tableName: "rate_limits",
    tableCreated: true,
    keyPrefix: "sizing",
    points: env().SIZING_REQUESTS_PER_MINUTE,
    duration: 60,
  });
  return limiter;
}

/** A loader's or action's arguments: the request and the context the HTTP server filled in. */
export type RequestArgs = { request: Request; context?: unknown };

/**
 * Who is asking: the address the app's HTTP server saw on the socket, or the client a trusted
 * proxy named (app/serve.server.ts believes X-Forwarded-For only from TRUSTED_PROXIES). Headers
 * a client sends itself never choose the key. Without that server (the Vite dev server, tests
 * calling routes directly) every request shares one key.
 */
export function clientKey({ context }: RequestArgs): string {
  const address = context instanceof RouterContextProvider ? context.get(clientAddressContext) : null;
  return `client:${address ?? "unknown"}`;
}

export type LimitResult = { ok: true } | { ok: false; retryAfterS: number };

/** Signed-in people are counted by account, so colleagues behind one address don't share. */
export async function consumeSizingRequest(args: RequestArgs): Promise<LimitResult> {
  const user = await getOptionalUser(args.request);
  try {
    await sizingLimiter().consume(user ? `user:${user.id}` : clientKey(args));
    return { ok: true };
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return { ok: false, retryAfterS: Math.ceil(rejection.msBeforeNext / 1000) };
    throw rejection;
  }
}
