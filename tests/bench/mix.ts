import type { RequirementsInput } from "~/hydraulics";
import { AXIS_MIX } from "../support/hydraulics";

/**
 * The API benchmark's requests: the same mix of axes as the engine bench (feed, press, lift and
 * inclines either way), so the sizing share of a request compares with the in-process figure.
 */
export const REQUESTS: RequirementsInput[] = AXIS_MIX;
