import type { Route } from "./+types/api.v1.machines.sizing";
import { sizeMachine } from "~/hydraulics";
import { sizingEndpoint } from "~/services/sizing-api.server";

// POST /api/v1/machines/sizing: a machine (its axes, cycle and duty) as JSON in, the engine's
// MachineDesign out; bad input names each field by its path (axes.1.strokeMm).
const endpoint = sizingEndpoint("the machine", sizeMachine);

export const loader = () => endpoint.loader();
export const action = (args: Route.ActionArgs) => endpoint.action(args);
