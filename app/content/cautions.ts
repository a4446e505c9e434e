// The cautions shown with every preliminary circuit, on screen and in every export.
// One list, so the page, the review step and the workbooks always say the same.
export const CIRCUIT_CAUTIONS = [
  "This preliminary circuit is a starting point for a quotation, not a design approval. A qualified fluid-power engineer must review and sign off the design.",
  "ISO 4413 and the local codes and regulations of the installation apply.",
  "Load-holding valves (such as the counterbalance valve) belong directly on the cylinder port, flange-mounted or integrated, never at the end of a hose.",
  "Nobody works under a load held only by hydraulics: use mechanical supports or locks.",
  "Hoses and fittings must be rated for the relief setting, with the burst margin their standard requires.",
  "Release stored pressure (cylinders, accumulators, trapped lines) before any maintenance.",
] as const;
