import type { BomLine, Design, MachineDesign } from "~/hydraulics";

// What a published revision was sized as: one axis (a Design) or a machine of several axes
// (a MachineDesign). Every page, workbook and bid that reads a revision's design asks here, so
// the choice between the two is made in one place.

export type PublishedDesign = { kind: "axis"; design: Design } | { kind: "machine"; design: MachineDesign };

interface RevisionDesigns {
  axes: { name: string; design: unknown }[];
  machine?: MachineDesign | null;
}

export function publishedDesignOf(revision: RevisionDesigns | null | undefined): PublishedDesign | null {
  if (!revision) return null;
  if (revision.machine) return { kind: "machine", design: revision.machine };
  const design = (revision.axes[0]?.design ?? null) as Design | null;
  return design ? { kind: "axis", design } : null;
}

/** The long detail of a published design, folded on its page and loaded when opened. */
export type DetailPart = "bill" | "trail";
export const DETAIL_PARTS: readonly DetailPart[] = ["bill", "trail"];

/** A design without its long detail: what a page sends before the reader opens the bill or the trail. */
export type Summary<D extends { bom: unknown[]; trail: unknown[] }> = Omit<D, "bom" | "trail">;

/**
 * A published design as its page first shows it: everything but the bill's lines and the
 * calculation trail (two thirds of a design's data), with how many of each there are.
 */
export type PublishedSummary = ({ kind: "axis"; design: Summary<Design> } | { kind: "machine"; design: Summary<MachineDesign> }) & {
  counts: Record<DetailPart, number>;
};

export function summaryOf(published: PublishedDesign): PublishedSummary {
  const { bom, trail, ...shown } = published.design;
  const counts = { bill: bom.length, trail: trail.length };
  return published.kind === "machine"
    ? { kind: "machine", design: shown as Summary<MachineDesign>, counts }
    : { kind: "axis", design: shown as Summary<Design>, counts };
}

/** The bill shops price: the machine's when there is one, else the axis's. */
export const billOf = (revision: RevisionDesigns | null | undefined): BomLine[] => publishedDesignOf(revision)?.design.bom ?? [];

/** The figures the open-specs filter keeps on the spec row. */
export function headlineFigures(published: PublishedDesign): { reliefSettingBar: number; pumpFlowLpm: number } {
  return { reliefSettingBar: published.design.pressuresBar.reliefSetting, pumpFlowLpm: published.design.flowsLpm.pump };
}

/** The axis names of a published design: none for one axis (its bill serves it whole). */
export const axisNamesOf = (published: PublishedDesign | null): string[] => (published?.kind === "machine" ? published.design.axes.map((a) => a.name) : []);

export const POWER_UNIT_LABEL = "Power unit";

/**
 * Which axis a bill line serves: a machine's axis lines carry the axis after the first colon of
 * their key (`cylinder:Clamp`, machine-bom.ts; the engine's own keys have none), so a line of an
 * older revision still names its axis; every other line belongs to the one power unit. Null for
 * a design of one axis, where the question does not arise.
 */
export function servedBy(key: string, axisNames: string[]): string | null {
  if (!axisNames.length) return null;
  const colon = key.indexOf(":");
  return colon >= 0 ? key.slice(colon + 1) : POWER_UNIT_LABEL;
}
