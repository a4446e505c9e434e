import { gzipSync, constants } from "node:zlib";
import { RequirementsError } from "~/hydraulics";
import { consumeSizingRequest } from "./rate-limit.server";

// The sizing API's one way of answering, shared by POST /api/v1/sizing (an axis) and
// POST /api/v1/machines/sizing (a machine): JSON in, the engine's design out; bad input is a 400
// naming each field by its path, too many requests a 429, and never a 500.

const problem = (status: number, error: string, message: string, fieldErrors: Record<string, string[]> = {}, headers?: HeadersInit) =>
  Response.json({ error, message, fieldErrors }, { status, headers });

/** Whether the client takes gzip: listed with a q above 0, or `*` when gzip is not listed (RFC 9110 §12.5.3). */
function acceptsGzip(acceptEncoding: string | null): boolean {
  const weights = new Map<string, number>();
  for (const part of (acceptEncoding ?? "").split(",")) {
    const [coding, ...params] = part.split(";").map((p) => p.trim().toLowerCase());
    const q = params.find((p) => p.startsWith("q="));
    if (coding) weights.set(coding, q ? Number(q.slice(2)) : 1);
  }
  return (weights.get("gzip") ?? weights.get("*") ?? 0) > 0;
}

/**
 * A design as JSON (40–60 kB, two thirds of it the calculation trail), gzipped here in one call
 * at the fastest level when the client takes it. The app's compression middleware leaves a
 * response that says its encoding alone; its streaming gzip added 1.7 ms to this body on
 * loopback against 0.4 ms for this one call, and the trail's repeated words shrink nearly as well
 * at level 1 (about 13 kB, 12 % more than the default level 6).
 */
function designResponse(request: Request, json: string): Response {
  const headers = { "Content-Type": "application/json; charset=utf-8", Vary: "Accept-Encoding" };
  if (!acceptsGzip(request.headers.get("Accept-Encoding"))) return new Response(json, { headers });
  return new Response(gzipSync(json, { level: constants.Z_BEST_SPEED }), { headers: { ...headers, "Content-Encoding": "gzip" } });
}

/** `what` names the body in messages ("the requirements", "the machine"); `size` is the engine's entry point. */
export function sizingEndpoint(what: string, size: (body: unknown) => unknown) {
  const notPost = () => problem(405, "method_not_allowed", `POST ${what} as JSON to this address.`, {}, { Allow: "POST" });
  return {
    loader: notPost,
    async action(args: Parameters<typeof consumeSizingRequest>[0]) {
      const { request } = args;
      if (request.method !== "POST") return notPost();
      const limit = await consumeSizingRequest(args);
      if (!limit.ok) {
        return problem(429, "rate_limited", `Too many sizing requests. Try again in ${limit.retryAfterS} s.`, {}, { "Retry-After": String(limit.retryAfterS) });
      }
      // The root middleware has already refused bodies over REQUEST_LIMITS.jsonBytes.
      let body: unknown;
      try {
        body = JSON.parse(await request.text());
      } catch {
        return problem(400, "invalid_json", `Send ${what} as a JSON object.`);
      }
      try {
        return designResponse(request, JSON.stringify(size(body)));
      } catch (error) {
        if (error instanceof RequirementsError) return problem(400, "invalid_requirements", error.message, error.fieldErrors);
        // Valid input the engine could not size is the engine's limit, reported as such.
        console.error(`Sizing ${what} failed for valid input:`, error);
        return problem(422, "not_sizable", "These requirements passed the checks but could not be sized. Please tell us about it.");
      }
    },
  };
}
