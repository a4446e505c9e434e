import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
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

/**
 * Who is asking: the address the load balancer appended last to X-Forwarded-For (earlier
 * entries are the client's own claims), or one shared key when the app is reached directly.
 */
export function clientKey(request: Request) {
  const forwarded = request.headers.get("X-Forwarded-For");
  const last = forwarded?.split(",").pop()?.trim();
  return last || "direct";
}

export type LimitResult = { ok: true } | { ok: false; retryAfterS: number };

export async function consumeSizingRequest(request: Request): Promise<LimitResult> {
  try {
    await sizingLimiter().consume(clientKey(request));
    return { ok: true };
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) return { ok: false, retryAfterS: Math.ceil(rejection.msBeforeNext / 1000) };
    throw rejection;
  }
}
