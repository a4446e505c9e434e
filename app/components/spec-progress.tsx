import { Link } from "react-router";
import { SPEC_STEPS, type SpecStepId } from "~/content/spec-steps";

/** Where the buyer is in the spec form; completed steps link back. */
export function SpecProgress({ specId, current, completed }: { specId: string; current: SpecStepId; completed: readonly string[] }) {
  return (
    <nav aria-label="Spec steps" className="mb-6">
      <ol className="grid grid-cols-5 gap-2">
        {SPEC_STEPS.map((step, i) => {
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
            <li key={step.id} aria-current={here ? "step" : undefined}>
              {done || here ? <Link to={`/specs/${specId}/edit/${step.id}`}>{body}</Link> : body}
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
