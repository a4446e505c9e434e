import type { Route } from "./+types/api.v1.sizing";
import { RequirementsError, sizeCircuit } from "~/hydraulics";
import { consumeSizingRequest } from "~/services/rate-limit.server";

// POST /api/v1/sizing: the requirements of one axis as JSON in, the engine's Design as JSON out.
// Bad input is a 400 naming each field; it is never a 500.

const problem = (status: number, error: string, message: string, fieldErrors: Record<string, string[]> = {}, headers?: HeadersInit) =>
  Response.json({ error, message, fieldErrors }, { status, headers });

export function loader() {
  return problem(405, "method_not_allowed", "POST the requirements as JSON to this address.", {}, { Allow: "POST" });
}

export async function action(args: Route.ActionArgs) {
  const { request } = args;
  if (request.method !== "POST") {
    return problem(405, "method_not_allowed", "POST the requirements as JSON to this address.", {}, { Allow: "POST" });
  }
  const limit = await consumeSizingRequest(args);
  if (!limit.ok) {
    return problem(
      429,
      "rate_limited",
      `Too many sizing requests. Try again in ${limit.retryAfterS} s.`,
      {},
      {
        "Retry-After": String(limit.retryAfterS),
      },
    );
  }
  // The root middleware has already refused bodies over REQUEST_LIMITS.jsonBytes.
  const text = await request.text();
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return problem(400, "invalid_json", "Send the requirements as a JSON object.");
  }
  try {
    return Response.json(sizeCircuit(body));
  } catch (error) {
    if (error instanceof RequirementsError) {
      return problem(400, "invalid_requirements", error.message, error.fieldErrors);
    }
    // Valid input the engine could not size is the engine's limit, reported as such.
    console.error("Sizing failed for valid requirements:", error);
    return problem(422, "not_sizable", "These requirements passed the checks but could not be sized. Please tell us about it.");
  }
}
