/**
 * The job page's forms, on the shared fields: a refused change keeps what was typed and shows
 * the server's message beside its field; each form posts its own intent.
 */
import type { SubmissionResult } from "@conform-to/react";
import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { describe, expect, it } from "vitest";
import { ManagerNoteForm, ProgressNoteForm, ReachForm, TargetForm, UndoForm } from "~/components/job-forms";

const render = (element: React.ReactElement) => {
  const Stub = createRoutesStub([{ path: "/jobs/:jobId", Component: () => element }]);
  return renderToStaticMarkup(<Stub initialEntries={["/jobs/7b0c8f5e-3d1a-4c59-9a39-0f6f4f1d2a11"]} />);
};

const refused = (initialValue: Record<string, string>, error: Record<string, string[]>): SubmissionResult<string[]> => ({
  status: "error",
  initialValue,
  error,
});

describe("job forms", () => {
  it("offer the open milestones and keep a refused note with its message", () => {
    const html = render(
      <ReachForm
        open={["drawings_agreed", "in_build"]}
        lastResult={refused({ intent: "reach", milestone: "in_build", note: "Manifold machined." }, { note: ["Too long."] })}
      />,
    );
    expect(html).toContain('name="intent" value="reach"');
    expect(html).toContain("Drawings agreed");
    expect(html).toContain("In the workshop");
    expect(html).toContain("Manifold machined.</textarea>");
    expect(html).toContain("Too long.");
    expect(html).toMatch(/<textarea[^>]*aria-invalid="true"/);
  });

  it("each form posts its own intent with a submit button", () => {
    const forms: [React.ReactElement, string, string][] = [
      [<TargetForm key="t" open={["drawings_agreed"]} lastResult={undefined} />, "target", "Save the date"],
      [<ProgressNoteForm key="p" lastResult={undefined} />, "progress-note", "Add the note"],
      [<UndoForm key="u" last="drawings_agreed" lastResult={undefined} />, "undo", "Take it back"],
      [<ManagerNoteForm key="m" lastResult={undefined} />, "manager-note", "Save the note"],
    ];
    for (const [element, intent, button] of forms) {
      const html = render(element);
      expect(html).toContain(`name="intent" value="${intent}"`);
      expect(html).toMatch(new RegExp(`<button[^>]*type="submit"[^>]*>${button}</button>`));
    }
    // Taking back names the milestone the shop saw as last, so a stale page can't take back another.
    expect(render(<UndoForm last="drawings_agreed" lastResult={undefined} />)).toContain('name="milestone" value="drawings_agreed"');
  });
});
