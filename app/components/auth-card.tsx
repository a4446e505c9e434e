import { Logo } from "./logo";

/** The narrow centred card used by sign-in, sign-up and the link pages. */
export function AuthCard({ title, lead, children }: { title: string; lead?: React.ReactNode; children: React.ReactNode }) {
  return (
    <div className="mx-auto max-w-md">
      <div className="mb-6 flex items-center gap-3">
        <Logo size={36} />
        <div>
          <h1 className="text-2xl font-bold">{title}</h1>
          {lead ? <p className="text-sm text-ink-600">{lead}</p> : null}
        </div>
      </div>
      <div className="rounded-lg bg-white p-6 shadow-sm ring-1 ring-ink-100">{children}</div>
    </div>
  );
}
