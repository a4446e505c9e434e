/**
 * The spec form's steps keep what the buyer typed when the server refuses a step, also without
 * JavaScript (the page is then rendered from the action's reply alone), and a fresh step shows
 * the usual choices.
 */
import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { beforeAll, describe, expect, it } from "vitest";
import { loadEveryPart } from "~/components/loaded-later";
import { SpecStepForm, type SpecStepFormProps } from "~/components/spec-step-form";
import { specSteps } from "~/content/spec-steps";
import { refused } from "../support/conform";

const SPEC = "7b0c8f5e-3d1a-4c59-9a39-0f6f4f1d2a11";
const AXES = [
  { id: "axis01", name: "Clamp" },
  { id: "ram001", name: "Main ram" },
];

// The step-only questions and previews load as chunks of their own; the server has them at start.
beforeAll(loadEveryPart);

function render(props: Partial<Omit<SpecStepFormProps, "step">> & { step: string }) {
  const step = specSteps(AXES).find((s) => s.id === props.step)!;
  const all: SpecStepFormProps = {
    specId: SPEC,
    system: "metric",
    previous: null,
    context: { axes: AXES, others: [] },
    axisValues: null,
    machineBase: null,
    stepAnswers: {},
    attachments: [],
    attachmentLimits: { maxFileBytes: 10 * 1024 * 1024, maxFilesPerSpec: 10 },
    lastResult: null,
    ...props,
    step,
  };
  const Stub = createRoutesStub([{ path: "/specs/:specId/edit/:step", Component: () => <SpecStepForm {...all} /> }]);
  return renderToStaticMarkup(<Stub initialEntries={[`/specs/${SPEC}/edit/${props.step}`]} />);
}

describe("SpecStepForm", () => {
  it("keeps a typed title and purpose after a refused machine step, with the error beside the field", () => {
    const html = render({
      step: "machine",
      stepAnswers: { title: "Old title", "name-axis01": "Clamp", "name-ram001": "Main ram" },
      lastResult: refused(
        { title: "Veneer press, main ram", purpose: "Presses veneer onto panels", "name-axis01": "Clamp", "name-ram001": "clamp" },
        { "name-ram001": ["Another axis is already called “clamp”."] },
      ),
    });
    expect(html).toContain('value="Veneer press, main ram"');
    expect(html).not.toContain('value="Old title"');
    expect(html).toContain("Presses veneer onto panels</textarea>");
    // Each axis is listed with its name and its buttons; the typed name and its error stay.
    expect(html).toMatch(/name="name-ram001"[^>]*value="clamp"/);
    expect(html).toContain("Another axis is already called “clamp”.");
    for (const intent of ["up:ram001", "down:axis01", "duplicate:axis01", "remove:ram001", "add"]) expect(html).toContain(`value="${intent}"`);
  });

  it("keeps a typed axis answer after a refused motion step instead of the saved one", () => {
    const html = render({
      step: "ram001-motion",
      stepAnswers: { strokeMm: "300" },
      lastResult: refused({ strokeMm: "450", massKg: "abc" }, { massKg: ["Enter a number."] }),
    });
    expect(html).toMatch(/name="strokeMm"[^>]*value="450"/);
    expect(html).toContain("Enter a number.");
  });

  it("shows the usual choices on a fresh duty and quotation step, and each text limit in words", () => {
    const duty = render({ step: "duty" });
    expect(duty).toMatch(/<option value="400 V three-phase" selected="">/);
    expect(duty).toMatch(/<option value="ISO VG 46" selected="">/);
    const quotation = render({ step: "quotation" });
    expect(quotation).toMatch(/name="unitsWanted"[^>]*value="1"/);
    expect(quotation).toMatch(/name="retainerPercent"[^>]*value="20"/);
    expect(quotation).toContain("At most 80 characters.");
    expect(quotation).toContain('maxLength="4000"');
    expect(render({ step: "machine" })).toContain("At most 120 characters.");
    // A text area counts what is typed against its limit, starting from the saved answer.
    expect(render({ step: "machine", stepAnswers: { purpose: "Presses veneer" } })).toContain("14 of 2,000 characters");
  });
});

describe("the cycle step", () => {
  it("gives each motion its step and reads the cycle back in words", () => {
    const html = render({
      step: "cycle",
      stepAnswers: { "extend-axis01": "1", "extend-ram001": "2", "retract-ram001": "3", "retract-axis01": "4" },
    });
    expect(html).toMatch(/name="extend-ram001"/);
    expect(html).toContain("Clamp extends, then Main ram extends, then Main ram retracts, then Clamp retracts.");
    const together = render({ step: "cycle", stepAnswers: { "extend-axis01": "1", "extend-ram001": "1", "retract-ram001": "2", "retract-axis01": "2" } });
    expect(together).toContain("Clamp extends together with Main ram extends, then Clamp retracts together with Main ram retracts.");
  });
});
