import { ENGINE_VERSION } from "~/hydraulics";

// GET /api/v1/health: a liveness answer for load balancers (and the benchmark's bare baseline).
export function loader() {
  return Response.json({ ok: true, engineVersion: ENGINE_VERSION });
}
