import { Children, Fragment } from "react";
import { Form, Link, type LinkProps } from "react-router";

// The small set of shared building blocks that give every page the same look.

const tone = {
  primary: "bg-flow-600 text-white hover:bg-flow-700 disabled:bg-ink-200",
  secondary: "bg-white text-ink-800 ring-1 ring-ink-200 hover:bg-ink-50",
  danger: "bg-white text-alarm-600 ring-1 ring-alarm-600/40 hover:bg-alarm-50",
  quiet: "text-flow-700 hover:underline",
} as const;
export type ButtonTone = keyof typeof tone;

const buttonBase = "inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed";

export function Button({ tone: t = "primary", className = "", ...props }: React.ButtonHTMLAttributes<HTMLButtonElement> & { tone?: ButtonTone }) {
  return <button className={`${buttonBase} ${tone[t]} ${className}`} {...props} />;
}

export function ButtonLink({ tone: t = "primary", className = "", ...props }: LinkProps & { tone?: ButtonTone }) {
  return <Link className={`${buttonBase} ${tone[t]} ${className}`} {...props} />;
}

export function PageHeader({ title, lead, actions }: { title: string; lead?: React.ReactNode; actions?: React.ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-2xl font-bold text-ink-900">{title}</h1>
        {lead ? <p className="mt-1 max-w-2xl text-ink-600">{lead}</p> : null}
      </div>
      {/* On a phone the actions wrap to another row, each on one line, rather than squeezing into columns of words. */}
      {actions ? <div className="flex flex-wrap gap-2 [&>*]:whitespace-nowrap">{actions}</div> : null}
    </div>
  );
}

/** A panel of a page; with a `title`, the panel's heading. */
/** A form's main action kept in view while the person reads: the bar sticks to the bottom of the window. */
export const STICKY_ACTION_BAR =
  "sticky bottom-0 z-10 -mx-2 flex flex-wrap items-center justify-between gap-3 rounded-t-lg bg-white/95 px-4 py-3 shadow-[0_-4px_12px_rgba(0,0,0,0.08)] ring-1 ring-ink-100 backdrop-blur";

export function Card({ className = "", title, children }: { className?: string; title?: string; children: React.ReactNode }) {
  return (
    <section className={`rounded-lg bg-white p-6 shadow-sm ring-1 ring-ink-100 ${className}`}>
      {title ? <h2 className="mb-3 font-semibold">{title}</h2> : null}
      {children}
    </section>
  );
}

export function EmptyState({ title, children, action }: { title: string; children: React.ReactNode; action?: React.ReactNode }) {
  return (
    <div className="rounded-lg border-2 border-dashed border-ink-200 bg-white px-6 py-12 text-center">
      <h2 className="text-lg font-semibold text-ink-800">{title}</h2>
      <div className="mx-auto mt-2 max-w-lg text-ink-600">{children}</div>
      {action ? <div className="mt-6">{action}</div> : null}
    </div>
  );
}

export function Badge({ children, tone: t = "neutral" }: { children: React.ReactNode; tone?: "neutral" | "good" | "warn" | "bad" }) {
  const colours = {
    neutral: "bg-ink-100 text-ink-700",
    good: "bg-flow-100 text-flow-700",
    warn: "bg-signal-50 text-signal-700",
    bad: "bg-alarm-50 text-alarm-600",
  }[t];
  return <span className={`inline-block rounded-full px-2.5 py-0.5 text-xs font-semibold ${colours}`}>{children}</span>;
}

export function Notice({ tone: t = "info", children }: { tone?: "info" | "warn" | "bad" | "good"; children: React.ReactNode }) {
  const colours = {
    info: "bg-ink-100 text-ink-800",
    warn: "bg-signal-50 text-signal-700 ring-1 ring-signal-500/30",
    bad: "bg-alarm-50 text-alarm-600 ring-1 ring-alarm-600/30",
    good: "bg-flow-50 text-flow-700 ring-1 ring-flow-500/30",
  }[t];
  return (
    <div role={t === "bad" ? "alert" : "status"} className={`rounded-md px-4 py-3 text-sm ${colours}`}>
      {children}
    </div>
  );
}

/** Page links that keep the other search parameters. */
export function Pager({ page, pageCount, search }: { page: number; pageCount: number; search: URLSearchParams }) {
  if (pageCount <= 1) return null;
  const href = (p: number) => {
    const next = new URLSearchParams(search);
    next.set("page", String(p));
    return `?${next}`;
  };
  return (
    <nav aria-label="Pages" className="mt-4 flex items-center justify-between text-sm">
      {page > 1 ? (
        <Link className="text-flow-700 hover:underline" to={href(page - 1)}>
          ← Previous
        </Link>
      ) : (
        <span />
      )}
      <span className="text-ink-600">
        Page {page} of {pageCount}
      </span>
      {page < pageCount ? (
        <Link className="text-flow-700 hover:underline" to={href(page + 1)}>
          Next →
        </Link>
      ) : (
        <span />
      )}
    </nav>
  );
}

/** The search box of a table page: a GET form that keeps its value; extra filters go inside. */
export function SearchBar({ label, placeholder, value, children }: { label: string; placeholder: string; value: string; children?: React.ReactNode }) {
  return (
    <Form method="get" role="search" className="mb-4 flex flex-wrap gap-2">
      <label htmlFor="q" className="sr-only">
        {label}
      </label>
      <input
        id="q"
        name="q"
        type="search"
        defaultValue={value}
        placeholder={placeholder}
        className="w-full max-w-sm rounded-md px-3 py-2 text-sm ring-1 ring-ink-200"
      />
      {children}
      <Button type="submit" tone="secondary">
        Search
      </Button>
    </Form>
  );
}

/**
 * A table wider than the screen scrolls sideways inside this box while its first column (what
 * each row is) stays in place. Keyboard users can focus the box to scroll it.
 */
export function TableScroll({ label, className = "", children }: { label: string; className?: string; children: React.ReactNode }) {
  return (
    <div
      role="region"
      aria-label={label}
      // eslint-disable-next-line jsx-a11y/no-noninteractive-tabindex -- a scrolling region must be reachable by keyboard
      tabIndex={0}
      // On a phone a table takes only the width its words need (max-sm:[&>table]:min-w-0) and its fixed first
      // column 8rem: a long title there would otherwise fill the box and hide every other column under it.
      className={`relative overflow-x-auto max-sm:[&_td:first-child]:min-w-32 max-sm:[&>table]:min-w-0 focus-visible:outline-2 focus-visible:outline-flow-600 [&_td:first-child]:sticky [&_td:first-child]:left-0 [&_td:first-child]:z-[1] [&_td:first-child]:bg-white [&_th:first-child]:sticky [&_th:first-child]:left-0 [&_th:first-child]:z-[1] [&_th:first-child]:bg-white ${className}`}
    >
      {children}
    </div>
  );
}

/** A table of a list page: its scrolling box and header row; the rows are its children. */
export function ListTable({
  label,
  columns,
  minWidth = "min-w-[40rem]",
  empty,
  pager,
  children,
}: {
  label: string;
  /** Said under the header when there are no rows (a search that matched nothing). */
  empty?: string;
  /** The list's page links, under the table. */
  pager?: React.ComponentProps<typeof Pager>;
  /** Header cells: a label, or a label with its classes (alignment, padding). An empty label is read out as `srLabel`. */
  columns: (string | { label: string; className?: string; srLabel?: string })[];
  minWidth?: string;
  children: React.ReactNode;
}) {
  const table = (
    <TableScroll label={label}>
      <table className={`w-full ${minWidth} text-left text-sm`}>
        <thead className="text-ink-600">
          <tr>
            {columns.map((c, i) => {
              const column = typeof c === "string" ? { label: c } : c;
              return (
                <th key={i} scope="col" className={`py-2 pr-3 ${column.className ?? ""}`}>
                  {column.label || (column.srLabel ? <span className="sr-only">{column.srLabel}</span> : null)}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
      {empty && Children.count(children) === 0 ? <p className="py-6 text-center text-ink-600">{empty}</p> : null}
    </TableScroll>
  );
  return (
    <>
      {table}
      {pager ? <Pager {...pager} /> : null}
    </>
  );
}

/** A form's refusal at the top of the page. */
export function ErrorNotice({ error }: { error: string | undefined | null }) {
  if (!error) return null;
  return (
    <div className="mb-4">
      <Notice tone="bad">{error}</Notice>
    </div>
  );
}

/** Whether a person may sign in. */
export function ActiveBadge({ active }: { active: boolean }) {
  return active ? <Badge tone="good">Active</Badge> : <Badge tone="bad">Deactivated</Badge>;
}

/**
 * The orders a list offers, as links that keep the search and filters (and go back to page 1);
 * the current one is marked, so the page always says how it is sorted.
 */
export function SortChoice({ options, current, search }: { options: Record<string, string>; current: string; search: URLSearchParams }) {
  const href = (sort: string) => {
    const next = new URLSearchParams(search);
    next.set("sort", sort);
    next.delete("page");
    return `?${next}`;
  };
  return (
    <nav aria-label="Sort" className="mb-3 flex flex-wrap items-center gap-2 text-sm">
      <span className="text-ink-600">Sorted by</span>
      {Object.entries(options).map(([key, label]) => (
        <Link
          key={key}
          to={href(key)}
          aria-current={key === current ? "true" : undefined}
          className={`rounded-full px-3 py-1 ring-1 ${key === current ? "bg-ink-800 font-semibold text-white ring-ink-800" : "ring-ink-200 hover:bg-ink-50"}`}
        >
          {label}
        </Link>
      ))}
    </nav>
  );
}

type Choice = { value: string; label: string };

export interface ListFilter {
  /** The URL parameter, and the select's id. */
  name: string;
  label: string;
  /** The first choice, which filters nothing. */
  any: string;
  options: Choice[];
}

/** The filters of a list's search form: a labelled select each, showing what the URL asks for. */
export function FilterSelects({ filters, search }: { filters: ListFilter[]; search: URLSearchParams }) {
  return filters.map((f) => (
    <Fragment key={f.name}>
      <label htmlFor={f.name} className="sr-only">
        {f.label}
      </label>
      <select id={f.name} name={f.name} defaultValue={search.get(f.name) ?? ""} className="rounded-md px-2 py-2 text-sm ring-1 ring-ink-200">
        <option value="">{f.any}</option>
        {f.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Fragment>
  ));
}

/** A one-field form in a table row: choose, then Save. `fields` are posted alongside (intent, the row's id). */
export function RowChoiceForm({
  id,
  name,
  label,
  options,
  value,
  fields,
}: {
  id: string;
  name: string;
  label: string;
  options: Choice[];
  value: string;
  fields: Record<string, string>;
}) {
  return (
    <Form method="post" className="flex items-center gap-1">
      {Object.entries(fields).map(([field, v]) => (
        <input key={field} type="hidden" name={field} value={v} />
      ))}
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <select id={id} name={name} defaultValue={value} className="rounded-md px-2 py-1 ring-1 ring-ink-200">
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <Button type="submit" tone="secondary" className="px-2 py-1">
        Save
      </Button>
    </Form>
  );
}
