import type { BomLine, Design, TrailEntry } from "~/hydraulics";
import type { DetailPart, PublishedSummary, Summary } from "~/services/published-design";
import type { UnitSystem } from "~/units";
import { AxisRequirements } from "./axis-requirements";
import { CircuitViewer } from "./circuit-viewer";
import { CycleChart } from "./cycle-chart";
import { CalculationTrail, CautionsPanel, ComponentTable, KeySizes, WarningsList } from "./design-panels";
import { FoldedSection, DetailLinks, type LazyDetail } from "./folded-section";
import { MachineReport } from "./machine-report";
import { MachineRequirements } from "./machine-requirements";
import { Card } from "./ui";

/**
 * A design as every page shows it: the circuit, its key sizes, the phases of one cycle (where
 * the stored design lists them), warnings, the cautions, the components and the calculation trail.
 */

type Detailed = { bom: BomLine[]; trail: TrailEntry[] };

/** A published report's long detail: how many lines and steps, and where each loads from when opened. */
export interface FoldedDetail {
  counts: Record<DetailPart, number>;
  lazy: Record<DetailPart, LazyDetail>;
}

/**
 * What a report of a design (an axis's or a machine's) is told: the whole design (live sizing,
 * the review), or a published design's summary with its bill and trail loaded when opened.
 */
export type ReportProps<D extends Detailed> = {
  units: UnitSystem;
  /** A newer design is on its way (live sizing): the report is dimmed. */
  updating?: boolean;
  componentsTitle?: string;
  /** Pages that ask the reader to confirm the cautions show them beside the confirmation instead. */
  cautions?: boolean;
} & ({ design: D; detail?: undefined } | { design: Summary<D>; detail: FoldedDetail });

/** How many bill lines and trail steps a report's design has. */
export const detailCounts = <D extends Detailed>(report: ReportProps<D>): Record<DetailPart, number> =>
  report.detail === undefined ? { bill: report.design.bom.length, trail: report.design.trail.length } : report.detail.counts;

/** The folded bill and calculation trail, drawn from the design or, in a published report, loaded when opened. */
export function FoldedDetails<D extends Detailed>({ report, bill }: { report: ReportProps<D>; bill: (design: D) => React.ReactNode }) {
  const counts = detailCounts(report);
  return (
    <>
      <FoldedSection id="bill" title={report.componentsTitle ?? "Components"} summary={`Show all ${counts.bill} lines`} lazy={report.detail?.lazy.bill}>
        {report.detail === undefined ? bill(report.design) : null}
      </FoldedSection>
      <FoldedSection id="calculation-trail" title="How every number was reached" summary={`Show ${counts.trail} steps`} lazy={report.detail?.lazy.trail}>
        {report.detail === undefined ? <CalculationTrail trail={report.design.trail} /> : null}
      </FoldedSection>
    </>
  );
}

export function DesignReport(report: ReportProps<Design>) {
  const { design, units, updating = false, componentsTitle = "Components", cautions = true } = report;
  return (
    <>
      <Card className={`transition-opacity ${updating ? "opacity-70" : ""}`}>
        <div className="mb-2 flex items-center justify-between">
          <h2 className="font-semibold">Preliminary circuit</h2>
          <span className="text-xs text-ink-400">{updating ? "Updating…" : `Engine ${design.engineVersion}`}</span>
        </div>
        <CircuitViewer circuit={design.circuit} units={units} />
        <DetailLinks componentsTitle={componentsTitle} bomLines={detailCounts(report).bill} />
      </Card>
      <KeySizes design={design} units={units} />
      <CycleChart cycle={design.cycle} units={units} />
      <WarningsList warnings={design.warnings} />
      {cautions ? <CautionsPanel /> : null}
      <FoldedDetails report={report} bill={(d) => <ComponentTable design={d} />} />
    </>
  );
}

/**
 * A published revision as its readers see it: what it must do, then its design, whether it was
 * sized as one axis or as a machine of several (publishedDesignOf decides which). The bill and
 * the trail come when opened, from `detail`.
 */
export function PublishedReport({
  published,
  units,
  componentsTitle,
  lazy,
}: {
  published: PublishedSummary;
  units: UnitSystem;
  componentsTitle?: string;
  lazy: FoldedDetail["lazy"];
}) {
  const detail = { counts: published.counts, lazy };
  return published.kind === "machine" ? (
    <>
      <MachineRequirements design={published.design} units={units} />
      <MachineReport design={published.design} detail={detail} units={units} componentsTitle={componentsTitle} />
    </>
  ) : (
    <>
      <AxisRequirements requirements={published.design.requirements} units={units} />
      <DesignReport design={published.design} detail={detail} units={units} componentsTitle={componentsTitle} />
    </>
  );
}
