import { useEffect, useRef, useState } from "react";
import { flushSync } from "react-dom";
import { useFetcher, useLocation } from "react-router";
import { Card } from "./ui";

/**
 * Detail that is not in the page until opened: `href` is the page asked for it (its loader then
 * returns `detail.html`), loaded by a fetcher when the section opens; `html` is set when the page
 * was asked for it already (following the link, as without JavaScript).
 */
export interface LazyDetail {
  href: string;
  html: string | null;
}

/**
 * Long detail (the full bill, the calculation trail) folded under its heading: one click opens
 * it, a link to its id opens it too, and it prints open. Its content is drawn when it first opens,
 * not with the page (`?show=<id>` draws it open on the server, for a browser without JavaScript);
 * with `lazy`, the content itself loads when it first opens instead of coming with the page.
 */
export function FoldedSection({
  id,
  title,
  summary,
  children,
  lazy,
}: {
  id: string;
  title: string;
  summary: string;
  children?: React.ReactNode;
  lazy?: LazyDetail;
}) {
  const ref = useRef<HTMLDetailsElement>(null);
  const location = useLocation();
  const asked = new URLSearchParams(location.search).getAll("show").includes(id);
  const startsOpen = Boolean(lazy?.html) || asked;
  const [open, setOpen] = useState(startsOpen);
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
      // The page prints right after this handler: draw the content now, not on the toggle event.
      flushSync(() => setOpen(true));
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
      <details ref={ref} id={id} className="group scroll-mt-4" open={startsOpen ? true : undefined} onToggle={() => ref.current?.open && setOpen(true)}>
        <summary className="flex cursor-pointer list-none items-baseline justify-between gap-3 [&::-webkit-details-marker]:hidden">
          <h2 className="font-semibold">{title}</h2>
          <span className="text-sm font-semibold text-flow-700">
            <span className="group-open:hidden">{summary} ▾</span>
            <span className="hidden group-open:inline">Fold ▴</span>
          </span>
        </summary>
        <div className="mt-3">
          {lazy ? <LazyBody id={id} title={title} lazy={lazy} open={open} /> : open ? children : <ShowLink id={id} title={title} search={location.search} />}
        </div>
      </details>
    </Card>
  );
}

/** Without JavaScript, a folded section's content is one link away: this page, drawn with it open. */
function ShowLink({ id, title, search }: { id: string; title: string; search: string }) {
  const query = new URLSearchParams(search);
  query.append("show", id);
  return (
    <a href={`?${query}#${id}`} className="text-sm font-semibold text-flow-700 hover:underline">
      Show {title.toLowerCase()}
    </a>
  );
}

/** A lazy section's content: fetched the first time the section is open. */
function LazyBody({ id, title, lazy, open }: { id: string; title: string; lazy: LazyDetail; open: boolean }) {
  const fetcher = useFetcher<{ detail?: { html: string } | null }>();
  const html = lazy.html ?? fetcher.data?.detail?.html ?? null;
  const { load, state } = fetcher;
  // Asked once: should it fail, the link below stays for a retry instead of a loop of requests.
  const asked = useRef(false);
  useEffect(() => {
    if (!open || html !== null || asked.current) return;
    asked.current = true;
    void load(lazy.href);
  }, [open, html, load, lazy.href]);
  // Our own server's rendering of a published design (escaped by React), never a person's HTML.
  if (html !== null) return <div dangerouslySetInnerHTML={{ __html: html }} />;
  if (state === "loading") return <p className="text-sm text-ink-600">Loading…</p>;
  return (
    <a href={`${lazy.href}#${id}`} className="text-sm font-semibold text-flow-700 hover:underline">
      Show {title.toLowerCase()}
    </a>
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
