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

/**
 * Requests a worker has taken from the shared count ahead of time, per key: one round trip to
 * PostgreSQL takes a few, and the next requests of that key on this worker use them up until
 * they run out or their window ends. The shared count still holds every request any worker
 * answers, so the limit is never passed; a key may be refused a few requests early while another
 * worker holds points it has not used. Bounded: expired entries are dropped as it grows.
 */
const held = new Map<string, { left: number; until: number }>();
const HELD_KEYS = 10_000;

/** How many requests one round trip takes: a twentieth of the limit, at most 5 (1 for small limits, as tests set). */
const batchOf = (points: number) => Math.max(1, Math.min(5, Math.floor(points / 20)));

async function takeShared(key: string): Promise<LimitResult> {
  const now = Date.now();
  const mine = held.get(key);
  if (mine && mine.left > 0 && mine.until > now) {
    mine.left--;
    return { ok: true };
  }
  const limiter = sizingLimiter();
  const batch = batchOf(limiter.points);
  try {
    const taken = await limiter.consume(key, batch);
    if (held.size >= HELD_KEYS) for (const [k, v] of held) if (v.until <= now) held.delete(k);
    held.set(key, { left: batch - 1, until: now + taken.msBeforeNext });
    return { ok: true };
  } catch (rejection) {
    if (!(rejection instanceof RateLimiterRes)) throw rejection;
    if (batch > 1 && rejection.consumedPoints - batch < limiter.points) {
      // Fewer than a batch left in this window: give the batch back and take one.
      await limiter.reward(key, batch);
      held.delete(key);
      return takeOne(key);
    }
    return { ok: false, retryAfterS: Math.ceil(rejection.msBeforeNext / 1000) };
  }
}

async function takeOne(key: string): Promise<LimitResult> {
  try {
    await sizingLimiter().consume(key);
    return { ok: true };
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return { ok: false, retryAfterS: Math.ceil(rejection.msBeforeNext / 1000) };
    throw rejection;
  }
}

/** Signed-in people are counted by account, so colleagues behind one address don't share. */
export async function consumeSizingRequest(args: RequestArgs): Promise<LimitResult> {
  const user = await getOptionalUser(args.request);
  return takeShared(user ? `user:${user.id}` : clientKey(args));
}
