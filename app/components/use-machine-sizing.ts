import { useDeferredValue, useEffect, useMemo, useState } from "react";
import type { MachineDesign, MachineMotion } from "~/hydraulics";
import { machineProblems } from "~/content/machine-input";

// The cycle step sizes the machine in the browser as the buyer chooses its cycle (the engine is
// pure and runs there as on the server); machine-preview.tsx shows the result.

export interface MachineSizing {
  machine: MachineDesign | null;
  problems: string[];
}

type Engine = typeof import("~/content/machine-sizing");

/**
 * The engine, loaded once a machine is to be sized: it is a third of the spec form's script and
 * only this step runs it in the browser, so the other steps (and quick sizing, which asks the
 * API) never load it. Null until it has arrived, also on the server's first render.
 */
function useEngine(wanted: boolean): Engine | null {
  const [engine, setEngine] = useState<Engine | null>(null);
  useEffect(() => {
    if (wanted && !engine) void import("~/content/machine-sizing").then(setEngine);
  }, [wanted, engine]);
  return engine;
}

/** Sizes the machine of the saved axes and duty with the cycle being chosen. */
export function useMachineSizing(base: Record<string, unknown> | null, sequence: MachineMotion[][], axes: { id: string; name: string }[]): MachineSizing {
  const deferred = useDeferredValue(sequence);
  const engine = useEngine(base !== null);
  return useMemo(() => {
    if (!base || !engine) return { machine: null, problems: [] };
    const { sizeMachine, RequirementsError, NotSizableError } = engine;
    try {
      return { machine: sizeMachine({ ...base, sequence: deferred }), problems: [] };
    } catch (error) {
      if (error instanceof RequirementsError)
        return { machine: null, problems: machineProblems({ axes: axes.map((a) => ({ ...a, mounting: {}, motion: {} })) }, error.fieldErrors) };
      if (error instanceof NotSizableError) return { machine: null, problems: [error.message] };
      throw error;
    }
  }, [base, deferred, axes, engine]);
}
