import type { Design } from "~/hydraulics";
import type { PublishedDesign } from "~/services/published-design";
import type { UnitSystem } from "~/units";
import { AxisRequirements } from "./axis-requirements";
import { CircuitViewer } from "./circuit-viewer";
import { CycleChart } from "./cycle-chart";
import { CalculationTrail, CautionsPanel, ComponentTable, KeySizes, WarningsList } from "./design-panels";
import { FoldedSection, DetailLinks } from "./folded-section";
import { MachineReport } from "./machine-report";
import { MachineRequirements } from "./machine-requirements";
import { Card } from "./ui";

/**
 * A design as every page shows it: the circuit, its key sizes, the phases of one cycle (where
 * the stored design lists them), warnings, the cautions, the components and the calculation trail.
 */
/** What a report of a design (an axis's or a machine's) is told. */
export interface ReportProps<D> {
  design: D;
  units: UnitSystem;
  /** A newer design is on its way (live sizing): the report is dimmed. */
  updating?: boolean;
  componentsTitle?: string;
  /** Pages that ask the reader to confirm the cautions show them beside the confirmation instead. */
  cautions?: boolean;
}

export function DesignReport({ design, units, updating = false, componentsTitle = "Components", cautions = true }: ReportProps<Design>) {
  return (
    <>
      <Card className={`transition-opacity ${updating ? "opacity-70" : ""}`}>
        <div className="mb-2 flex items-center justify-between">
          <h2 className="font-semibold">Preliminary circuit</h2>
          <span className="text-xs text-ink-400">{updating ? "Updating…" : `Engine ${design.engineVersion}`}</span>
        </div>
        <CircuitViewer design={design} units={units} />
        <DetailLinks componentsTitle={componentsTitle} bomLines={design.bom.length} />
      </Card>
      <KeySizes design={design} units={units} />
      <CycleChart cycle={design.cycle} units={units} />
      <WarningsList warnings={design.warnings} />
      {cautions ? <CautionsPanel /> : null}
      <FoldedSection id="bill" title={componentsTitle} summary={`Show all ${design.bom.length} lines`}>
        <ComponentTable design={design} />
      </FoldedSection>
      <FoldedSection id="calculation-trail" title="How every number was reached" summary={`Show ${design.trail.length} steps`}>
        <CalculationTrail trail={design.trail} />
      </FoldedSection>
    </>
  );
}

/**
 * A published revision as its readers see it: what it must do, then its design, whether it was
 * sized as one axis or as a machine of several (publishedDesignOf decides which).
 */
export function PublishedReport({ published, units, componentsTitle }: { published: PublishedDesign; units: UnitSystem; componentsTitle?: string }) {
  return published.kind === "machine" ? (
    <>
      <MachineRequirements design={published.design} units={units} />
      <MachineReport design={published.design} units={units} componentsTitle={componentsTitle} />
    </>
  ) : (
    <>
      <AxisRequirements requirements={published.design.requirements} units={units} />
      <DesignReport design={published.design} units={units} componentsTitle={componentsTitle} />
    </>
  );
}
