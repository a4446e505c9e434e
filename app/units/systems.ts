export const UNIT_SYSTEMS = ["metric", "us"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = {
  metric: "Metric (mm, kg, bar)",
  us: "US customary (in, lb, psi)",
};
