// Quick sizing of a machine: the axes as the machine engine takes them, and its problems told
// back beside each axis's own field.
import { describe, expect, it } from "vitest";
import { nextAxisName, quickMachineInput, splitMachineErrors, type QuickAxis } from "~/content/quick-machine";
import { EXAMPLE_AXIS, toFormValues, typedAnswers } from "~/content/requirement-fields";
import { RequirementsError, sizeMachine } from "~/hydraulics";

const example = typedAnswers(toFormValues(EXAMPLE_AXIS, "metric"), "metric");
const axis = (key: number, name: string, changes: Record<string, string> = {}): QuickAxis => ({
  key,
  name,
  typed: { ...example, ...Object.fromEntries(Object.entries(changes).map(([k, text]) => [k, { text, system: "metric" as const }])) },
});

describe("quick sizing of a machine", () => {
  it("sends each axis's own answers with its name and the duty once, and the engine sizes it", () => {
    const input = quickMachineInput([axis(0, " Press "), axis(1, "Clamp", { strokeMm: "50", cyclesPerHour: "999" })], {
      ...example,
      cyclesPerHour: { text: "90", system: "metric" },
    });
    const axes = input.axes as Record<string, unknown>[];
    expect(axes.map((a) => a.name)).toEqual(["Press", "Clamp"]);
    expect(axes[1].strokeMm).toBe(50);
    for (const a of axes) expect(a).not.toHaveProperty("cyclesPerHour");
    expect(input.cyclesPerHour).toBe(90);
    const m = sizeMachine(input);
    expect(m.axes.map((a) => a.name)).toEqual(["Press", "Clamp"]);
    expect(m.requirements.cyclesPerHour).toBe(90);
  });

  it("puts each of the engine's problems beside its axis's field, the duty's beside the machine's", () => {
    const axes = [axis(0, "Press"), axis(1, "Press", { strokeMm: "-5" })];
    let errors: Record<string, string[]> = {};
    try {
      sizeMachine(quickMachineInput(axes, { ...example, hoursPerDay: { text: "30", system: "metric" } }));
    } catch (error) {
      if (!(error instanceof RequirementsError)) throw error;
      errors = error.fieldErrors;
    }
    const split = splitMachineErrors(errors, 2);
    expect(split.axes[1].strokeMm?.length).toBeGreaterThan(0);
    expect(split.axes[1].name).toEqual(["Another axis already has this name"]);
    expect(split.axes[0].strokeMm).toBeUndefined();
    expect(split.machine.hoursPerDay?.length).toBeGreaterThan(0);
    expect(splitMachineErrors({ axes: ["Give between 1 and 8 axes"] }, 2).machine._form).toEqual(["Give between 1 and 8 axes"]);
  });

  it("names a new axis with a name no axis has", () => {
    expect(nextAxisName([{ name: "Axis 1" }])).toBe("Axis 2");
    expect(nextAxisName([{ name: "Axis 1" }, { name: "axis 3" }])).toBe("Axis 4");
    expect(nextAxisName([{ name: "Press" }, { name: "Clamp" }])).toBe("Axis 3");
  });
});
