import { useEffect, useState } from "react";

// Optional refinements of the axis behind a native disclosure: the page stays short, it works
// without JavaScript, and its fields are posted whether it is open or not. It opens by itself
// when one of its answers needs attention, and stays as the person left it otherwise.

export function MoreQuestions({
  title,
  summary,
  startOpen,
  attention,
  children,
}: {
  title: string;
  /** What is inside, so nobody has to open it to find out. */
  summary: string;
  /** Open on arrival, e.g. because an answer inside differs from its default. */
  startOpen: boolean;
  /** An answer inside has a problem: open it so the message is seen. */
  attention: boolean;
  children: React.ReactNode;
}) {
  const [open, setOpen] = useState(startOpen || attention);
  useEffect(() => {
    if (attention) setOpen(true);
  }, [attention]);
  return (
    <details open={open} onToggle={(e) => setOpen(e.currentTarget.open)} className="group rounded-md ring-1 ring-ink-100">
      <summary className="cursor-pointer list-none px-3 py-2 text-sm">
        <span className="font-semibold text-flow-700">
          <span aria-hidden className="mr-1 inline-block transition-transform group-open:rotate-90">
            ▸
          </span>
          {title}
        </span>
        <span className="block text-xs text-ink-600">{summary} (optional)</span>
      </summary>
      <div className="space-y-4 border-t border-ink-100 px-3 pb-3 pt-3">{children}</div>
    </details>
  );
}
