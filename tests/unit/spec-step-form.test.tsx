/**
 * The spec form's steps keep what the buyer typed when the server refuses a step, also without
 * JavaScript (the page is then rendered from the action's reply alone), and a fresh step shows
 * the usual choices.
 */
import type { SubmissionResult } from "@conform-to/react";
import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { describe, expect, it } from "vitest";
import { SpecStepForm, type SpecStepFormProps } from "~/components/spec-step-form";

const SPEC = "7b0c8f5e-3d1a-4c59-9a39-0f6f4f1d2a11";

function render(props: Partial<SpecStepFormProps> & Pick<SpecStepFormProps, "step">) {
  const all: SpecStepFormProps = {
    specId: SPEC,
    system: "metric",
    answers: {},
    stepAnswers: {},
    attachments: [],
    attachmentLimits: { maxFileBytes: 10 * 1024 * 1024, maxFilesPerSpec: 10 },
    lastResult: null,
    ...props,
  };
  const Stub = createRoutesStub([{ path: "/specs/:specId/edit/:step", Component: () => <SpecStepForm {...all} /> }]);
  return renderToStaticMarkup(<Stub initialEntries={[`/specs/${SPEC}/edit/${props.step}`]} />);
}

/** What the action answers when a step is refused: Conform's reply, with what was posted. */
const refused = (initialValue: Record<string, string>, error: Record<string, string[]>): SubmissionResult<string[]> => ({
  status: "error",
  initialValue,
  error,
});

describe("SpecStepForm", () => {
  it("keeps a typed title and purpose after a refused machine step, with the error beside the field", () => {
    const html = render({
      step: "machine",
      stepAnswers: { title: "Old title" },
      lastResult: refused({ title: "Veneer press, main ram", purpose: "Presses veneer onto panels" }, { orientation: ["Choose how the axis moves."] }),
    });
    expect(html).toContain('value="Veneer press, main ram"');
    expect(html).not.toContain('value="Old title"');
    expect(html).toContain("Presses veneer onto panels</textarea>");
    expect(html).toContain("Choose how the axis moves.");
  });

  it("keeps a typed axis answer after a refused motion step instead of the saved one", () => {
    const html = render({
      step: "motion",
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
