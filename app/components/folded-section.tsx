import { useEffect, useRef } from "react";
import { Card } from "./ui";

/**
 * Long detail (the full bill, the calculation trail) folded under its heading: one click opens
 * it, a link to its id opens it too, and it prints open.
 */
export function FoldedSection({ id, title, summary, children }: { id: string; title: string; summary: string; children: React.ReactNode }) {
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    const details = ref.current;
    if (!details) return;
    const openIfTarget = () => {
      if (window.location.hash === `#${id}`) details.open = true;
    };
    let wasOpen = details.open;
    const beforePrint = () => {
      wasOpen = details.open;
      details.open = true;
    };
    const afterPrint = () => {
      details.open = wasOpen;
    };
    openIfTarget();
    window.addEventListener("hashchange", openIfTarget);
    window.addEventListener("beforeprint", beforePrint);
    window.addEventListener("afterprint", afterPrint);
    return () => {
      window.removeEventListener("hashchange", openIfTarget);
      window.removeEventListener("beforeprint", beforePrint);
      window.removeEventListener("afterprint", afterPrint);
    };
  }, [id]);
  return (
    <Card>
      <details ref={ref} id={id} className="group scroll-mt-4">
        <summary className="flex cursor-pointer list-none items-baseline justify-between gap-3 [&::-webkit-details-marker]:hidden">
          <h2 className="font-semibold">{title}</h2>
          <span className="text-sm font-semibold text-flow-700">
            <span className="group-open:hidden">{summary} ▾</span>
            <span className="hidden group-open:inline">Fold ▴</span>
          </span>
        </summary>
        <div className="mt-3">{children}</div>
      </details>
    </Card>
  );
}

/** Under the diagram: one click to the folded bill and calculation trail further down. */
export function DetailLinks({ componentsTitle, bomLines }: { componentsTitle: string; bomLines: number }) {
  return (
    <p className="mt-3 flex flex-wrap gap-x-4 gap-y-1 text-sm">
      <a href="#bill" className="font-semibold text-flow-700 hover:underline">
        {componentsTitle} ({bomLines} lines)
      </a>
      <a href="#calculation-trail" className="font-semibold text-flow-700 hover:underline">
        How every number was reached
      </a>
    </p>
  );
}
