// The draft's answer layout: drafts saved before machines read as one axis, a draft written and
// read again is the same, and the cycle's helpers.
import { describe, expect, it } from "vitest";
import {
  FIRST_AXIS_ID,
  copyName,
  cycleAnswers,
  cycleInWords,
  cycleSteps,
  defaultCycle,
  freshAxisName,
  newAxisId,
  readDraft,
  stepIdsOf,
  writeDraft,
} from "~/content/spec-draft";
import { machineInput, machineProblems } from "~/content/machine-input";

const OLD = {
  machine: { title: "Lift", purpose: "Lifts pallets", orientation: "vertical", rodDirection: "up", mounting: "pinned-pinned" },
  motion: { massKg: "800", strokeMm: "500", extendSpeedMmS: "100", retractSpeedMmS: "150" },
  duty: { cyclesPerHour: "60", hoursPerDay: "8", holdMinutes: "20", supplyVoltage: "400 V three-phase" },
  quotation: { unitsWanted: "2" },
};

describe("readDraft", () => {
  it("reads a draft saved before machines as its one axis, with its completed steps where the form now asks them", () => {
    const { draft, completed } = readDraft(OLD, ["machine", "motion", "duty"]);
    expect(draft.machine).toEqual({ title: "Lift", purpose: "Lifts pallets" });
    expect(draft.axes).toEqual([
      {
        id: FIRST_AXIS_ID,
        name: "Axis 1",
        mounting: { orientation: "vertical", rodDirection: "up", mounting: "pinned-pinned" },
        motion: { ...OLD.motion, holdMinutes: "20" },
      },
    ]);
    expect(draft.duty).toEqual({ cyclesPerHour: "60", hoursPerDay: "8", supplyVoltage: "400 V three-phase" });
    expect(completed.sort()).toEqual(["axis01-motion", "axis01-mounting", "duty", "machine"]);
  });

  it("reads back what it writes, and drops what does not belong to a listed axis", () => {
    const { draft } = readDraft(OLD);
    draft.axes.push({ id: "ram001", name: "Ram", mounting: { orientation: "horizontal" }, motion: { strokeMm: "90" } });
    draft.cycle = defaultCycle(draft.axes);
    const stored = writeDraft(draft);
    expect(stored.machine).toMatchObject({ axes: "axis01 ram001", "name-axis01": "Axis 1", "name-ram001": "Ram" });
    expect(readDraft(stored).draft).toEqual(draft);
    // A stray record of an axis no longer listed, a forged id or a duty answer on an axis are not read.
    const forged: Record<string, Record<string, string>> = {
      ...stored,
      "zzzzzz-motion": { strokeMm: "1" },
      machine: { ...stored.machine, axes: "axis01 ram001 ../x" },
    };
    forged["ram001-motion"] = { ...forged["ram001-motion"], cyclesPerHour: "999" };
    const again = readDraft(forged).draft;
    expect(again.axes.map((a) => a.id)).toEqual(["axis01", "ram001"]);
    expect(again.axes[1].motion).toEqual({ strokeMm: "90" });
  });

  it("lists the steps of a machine: each axis's two, the cycle only with two axes or more", () => {
    expect(stepIdsOf({ axes: [{ id: "axis01", name: "A", mounting: {}, motion: {} }] })).toEqual([
      "machine",
      "axis01-mounting",
      "axis01-motion",
      "duty",
      "quotation",
    ]);
    expect(stepIdsOf(readDraft({ machine: { axes: "axis01 ram001" } }).draft)).toContain("cycle");
  });
});

describe("names and ids", () => {
  it("gives a new axis a free id and name, and a copy a name of its own within the limit", () => {
    const ids = ["aaaaaa"];
    let calls = 0;
    // The first draw is taken: a second is made.
    expect(newAxisId(ids, () => (calls++ < 6 ? 0 : 0.5))).toBe("ssssss");
    expect(freshAxisName([{ name: "Axis 1" }, { name: "Axis 3" }])).toBe("Axis 4");
    expect(freshAxisName([{ name: "Clamp" }])).toBe("Axis 2");
    expect(copyName("Clamp", [{ name: "Clamp" }, { name: "Clamp (copy)" }])).toBe("Clamp (copy 2)");
    expect(copyName("x".repeat(80), []).length).toBeLessThanOrEqual(80);
  });
});

describe("the cycle", () => {
  const axes = [
    { id: "axis01", name: "Clamp" },
    { id: "ram001", name: "Main ram" },
  ];

  it("defaults to one after another and groups motions of the same step", () => {
    expect(cycleInWords(axes, cycleSteps(axes, defaultCycle(axes)))).toBe("Clamp extends, then Clamp retracts, then Main ram extends, then Main ram retracts.");
    const together = { "extend-axis01": "1", "extend-ram001": "1", "retract-ram001": "3", "retract-axis01": "7" };
    expect(cycleSteps(axes, together)).toEqual([
      [
        { axisId: "axis01", motion: "extend" },
        { axisId: "ram001", motion: "extend" },
      ],
      [{ axisId: "ram001", motion: "retract" }],
      [{ axisId: "axis01", motion: "retract" }],
    ]);
  });

  it("places a new axis's motions after the saved ones", () => {
    const three = [...axes.map((a) => ({ ...a, mounting: {}, motion: {} })), { id: "ejc001", name: "Ejector", mounting: {}, motion: {} }];
    const answers = cycleAnswers({ axes: three, cycle: { "extend-axis01": "1", "extend-ram001": "2", "retract-ram001": "3", "retract-axis01": "4" } });
    expect(answers).toMatchObject({ "extend-ejc001": "5", "retract-ejc001": "6" });
  });

  it("hands the engine each axis with its name, the duty once, and the cycle only where it is not the default", () => {
    const { draft } = readDraft({
      machine: { axes: "axis01 ram001", "name-axis01": "Clamp", "name-ram001": "Main ram" },
      "axis01-motion": { strokeMm: "80" },
      "ram001-motion": { strokeMm: "400" },
      duty: { cyclesPerHour: "60", supplyVoltage: "400 V three-phase" },
    });
    const plain = machineInput(draft, "metric");
    expect(plain).toEqual({
      axes: [
        { name: "Clamp", strokeMm: 80 },
        { name: "Main ram", strokeMm: 400 },
      ],
      cyclesPerHour: 60,
    });
    draft.cycle = { "extend-axis01": "1", "extend-ram001": "2", "retract-ram001": "3", "retract-axis01": "4" };
    expect(machineInput(draft, "metric").sequence).toEqual([
      [{ axis: "Clamp", motion: "extend" }],
      [{ axis: "Main ram", motion: "extend" }],
      [{ axis: "Main ram", motion: "retract" }],
      [{ axis: "Clamp", motion: "retract" }],
    ]);
    expect(
      machineProblems(draft, { "axes.1.strokeMm": ["Enter the stroke"], "sequence.0.0.axis": ["No axis has this name"], cyclesPerHour: ["Too many"] }),
    ).toEqual(["Main ram, stroke: Enter the stroke.", "Cycle: No axis has this name.", "Cycles per hour: Too many."]);
  });
});
