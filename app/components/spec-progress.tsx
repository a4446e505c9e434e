import { Link } from "react-router";
import type { StepRef } from "~/content/spec-steps";

// Where the buyer is in the spec form: the machine's steps in order, with one "Axes" place
// listing each axis and how far it is answered. Completed steps (and the current one) link back.

export function SpecProgress({
  specId,
  steps,
  current,
  completed,
  axes,
}: {
  specId: string;
  steps: StepRef[];
  current: string;
  completed: readonly string[];
  axes: { id: string; name: string }[];
}) {
  const shared = steps.filter((s) => !s.axis);
  const axisSteps = steps.filter((s) => s.axis);
  // The axes sit after the machine step; each place is numbered as the buyer meets it.
  const places: ({ kind: "step"; step: StepRef } | { kind: "axes" })[] = [
    { kind: "step", step: shared[0] },
    { kind: "axes" },
    ...shared.slice(1).map((step) => ({ kind: "step" as const, step })),
  ];
  const reachable = (s: StepRef) => completed.includes(s.id) || s.id === current || s.kind === "review";
  const link = (s: StepRef, body: React.ReactNode, label?: string) =>
    reachable(s) ? (
      <Link to={`/specs/${specId}/edit/${s.id}`} aria-label={label}>
        {body}
      </Link>
    ) : (
      body
    );
  return (
    <nav aria-label="Spec steps" className="mb-6">
      <ol className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:flex">
        {places.map((place, i) => {
          if (place.kind === "axes") {
            const here = axisSteps.some((s) => s.id === current);
            const done = axisSteps.every((s) => completed.includes(s.id));
            return (
              <li key="axes" aria-current={here ? "step" : undefined} className="col-span-2 sm:col-span-3 lg:flex-[2]">
                <div
                  className={`border-t-4 pt-2 text-xs font-semibold ${here ? "border-flow-600 text-flow-700" : done ? "border-flow-500/50 text-ink-800" : "border-ink-200 text-ink-600"}`}
                >
                  <span className="block">
                    Step {i + 1}
                    {done ? " · done" : ""}
                  </span>
                  <span className="block text-sm">{axes.length === 1 ? "The axis" : `Axes (${axes.length})`}</span>
                  <ul aria-label="Axes" className="mt-1 space-y-0.5 font-normal">
                    {axes.map((axis) => {
                      const own = axisSteps.filter((s) => s.axis!.id === axis.id);
                      const count = own.filter((s) => completed.includes(s.id)).length;
                      return (
                        <li key={axis.id} className="flex flex-wrap items-baseline gap-x-2">
                          <span className="font-semibold text-ink-800 [overflow-wrap:anywhere]">{axis.name}</span>
                          {own.map((s) => (
                            <span
                              key={s.id}
                              aria-current={s.id === current ? "step" : undefined}
                              className={s.id === current ? "font-semibold text-flow-700" : ""}
                            >
                              {link(
                                s,
                                <span className={reachable(s) ? "text-flow-700 underline-offset-2 hover:underline" : "text-ink-400"}>
                                  {s.title}
                                  {completed.includes(s.id) ? " ✓" : ""}
                                </span>,
                                `${axis.name}: ${s.title}${completed.includes(s.id) ? ", done" : ""}`,
                              )}
                            </span>
                          ))}
                          <span className="sr-only">
                            {count} of {own.length} steps done
                          </span>
                        </li>
                      );
                    })}
                  </ul>
                </div>
              </li>
            );
          }
          const step = place.step;
          const done = completed.includes(step.id);
          const here = step.id === current;
          const tone = here ? "border-flow-600 text-flow-700" : done ? "border-flow-500/50 text-ink-800" : "border-ink-200 text-ink-400";
          const body = (
            <span className={`block border-t-4 pt-2 text-xs font-semibold ${tone}`}>
              <span className="block">
                Step {i + 1}
                {done ? " · done" : ""}
              </span>
              <span className="block text-sm">{step.title}</span>
            </span>
          );
          return (
            <li key={step.id} aria-current={here ? "step" : undefined} className="lg:flex-1">
              {done || here ? <Link to={`/specs/${specId}/edit/${step.id}`}>{body}</Link> : body}
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
