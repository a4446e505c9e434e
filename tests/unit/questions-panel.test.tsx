import { renderToStaticMarkup } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { describe, expect, it } from "vitest";
import { QuestionsPanel } from "~/components/questions-panel";
import type { QuestionsPanel as PanelData, QuestionView } from "~/services/questions.server";

const SPEC = "7b0c8f5e-3d1a-4c59-9a39-0f6f4f1d2a11";
const answered: QuestionView = {
  id: "1c7f0d1e-52a4-4f0e-9f53-5d3f9c1b2a01",
  body: "Is the hose kit part of the scope?",
  askedAt: "2030-03-01T09:00:00.000Z",
  askedBy: "A shop asked",
  isOwn: false,
  answer: "Yes, up to the cylinder ports.",
  answeredAt: "2030-03-02T09:00:00.000Z",
};
const own: QuestionView = {
  ...answered,
  id: "2c7f0d1e-52a4-4f0e-9f53-5d3f9c1b2a02",
  body: "Which paint colour?",
  askedBy: "Your question",
  isOwn: true,
  answer: null,
  answeredAt: null,
};

/** The panel as the page renders it, inside a router (its forms post through fetchers). */
function render(panel: PanelData) {
  const Stub = createRoutesStub([{ path: "/specs/:specId", Component: () => <QuestionsPanel specId={SPEC} panel={panel} /> }]);
  return renderToStaticMarkup(<Stub initialEntries={[`/specs/${SPEC}`]} />);
}

describe("QuestionsPanel", () => {
  it("shows a shop its own question as theirs, others' answered ones without a name, and the form to ask", () => {
    const html = render({ questions: [answered, own], canAsk: true, canAnswer: false, isBuyer: false, closedNote: null });
    expect(html).toContain("A shop asked");
    expect(html).toContain("Your question");
    expect(html).toContain("Yes, up to the cylinder ports.");
    expect(html).toContain("Only your company and the machine builder see this question until it is answered.");
    expect(html).toContain(`action="/specs/${SPEC}/questions"`);
    expect(html).toContain('maxLength="2000"');
    expect(html).not.toContain("/answer");
  });

  it("gives the buyer an answer form per question, filled with the current answer", () => {
    const html = render({
      questions: [
        { ...answered, askedBy: "Brackwater Hydraulik asked" },
        { ...own, isOwn: false, askedBy: "Cinderford Power Units asked" },
      ],
      canAsk: false,
      canAnswer: true,
      isBuyer: true,
      closedNote: null,
    });
    expect(html).toContain("Brackwater Hydraulik asked");
    expect(html).toContain(`action="/specs/${SPEC}/questions/${answered.id}/answer"`);
    expect(html).toContain(`action="/specs/${SPEC}/questions/${own.id}/answer"`);
    expect(html).toMatch(/<textarea[^>]*>Yes, up to the cylinder ports.<\/textarea>/);
    expect(html).toContain("Save the changed answer");
    expect(html).toContain("Publish the answer");
    expect(html).not.toContain(`action="/specs/${SPEC}/questions"`);
  });

  it("is read only with a note once questions are closed", () => {
    const html = render({
      questions: [answered],
      canAsk: false,
      canAnswer: false,
      isBuyer: false,
      closedNote: "This spec is no longer open for bids, so it takes no new questions.",
    });
    expect(html).not.toContain("<form");
    expect(html).toContain("takes no new questions");
  });
});
