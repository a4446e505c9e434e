import type { Route } from "./+types/api.v1.sizing";
import { sizeCircuit } from "~/hydraulics";
import { sizingEndpoint } from "~/services/sizing-api.server";

// POST /api/v1/sizing: the requirements of one axis as JSON in, the engine's Design as JSON out.
const endpoint = sizingEndpoint("the requirements", sizeCircuit);

export const loader = () => endpoint.loader();
export const action = (args: Route.ActionArgs) => endpoint.action(args);
