import { Link } from "react-router";
import type { Route } from "./+types/account";
import { requireRole } from "~/auth/permissions.server";
import { KIND_LABELS, PAGE_ROLES, ROLE_LABELS } from "~/auth/roles";
import { ActiveBadge, Badge, Card, ListTable, PageHeader } from "~/components/ui";
import { countOf } from "~/content/count";
import { formatDay, formatMoment } from "~/content/dates";
import { JOB_STAGE_LABELS } from "~/content/job-milestones";
import { APPROVAL_LABELS, APPROVAL_TONES } from "~/content/shop-approval";
import { SPEC_STATUS_LABELS, SPEC_STATUS_TONES } from "~/content/spec-status";
import { organisationPageOf, type OrganisationPage } from "~/services/organisation-page.server";
import { parseWithZod } from "@conform-to/zod/v4";
import { data } from "react-router";
import { redirectWithToast } from "~/auth/session.server";
import { OrganisationProfileCard } from "~/components/organisation-profile";
import { AccountNotes, AccountPayments, OpenSpecs } from "~/components/account-view";
import { AfterHandoverNote, OverdueBadge } from "~/components/job-state";
import { accountNoteSchema } from "~/schemas/account-notes";
import { accountViewOf, addAccountNote, daysLate, editAccountNote } from "~/services/account-view.server";

// The organisation page (accounts/:organisationId): a buyer account, a shop or the operator, as
// operator staff may see it. Which organisations open, and what shows, is the access policy's.

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.organisation.name ?? "Organisation"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await requireRole(request, PAGE_ROLES.accounts);
  const organisation = await organisationPageOf(viewer, params.organisationId);
  // Navigation only: where this person came from.
  const back = viewer.role === "admin" ? { to: "/admin/organisations", label: "Organisations" } : { to: "/accounts", label: "My accounts" };
  const account = organisation.kind === "buyer" ? await accountViewOf(viewer, organisation.id) : null;
  const jobs = organisation.jobs ? { ...organisation.jobs, recent: organisation.jobs.recent.map((j) => ({ ...j, daysLate: daysLate(j) })) } : null;
  return { organisation: { ...organisation, jobs }, account, back };
}

/** Notes on the account: add one, or edit one (its text replaced, who edited it and when kept). */
export async function action({ request, params }: Route.ActionArgs) {
  const viewer = await requireRole(request, PAGE_ROLES.accounts);
  const formData = await request.formData();
  const submission = parseWithZod(formData, { schema: accountNoteSchema });
  const noteId = String(formData.get("noteId") ?? "new").slice(0, 40);
  if (submission.status !== "success") return data({ noteId, result: submission.reply() }, { status: 400 });
  const note = submission.value;
  if (note.intent === "add-note") await addAccountNote(viewer, params.organisationId, note);
  else await editAccountNote(viewer, params.organisationId, note);
  return redirectWithToast(request, `/accounts/${params.organisationId}`, note.intent === "add-note" ? "Note added." : "Note saved.");
}

export default function OrganisationPageRoute({ loaderData, actionData }: Route.ComponentProps) {
  const { organisation: o, account, back } = loaderData;
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={back.to} className="text-flow-700 hover:underline">
          ← {back.label}
        </Link>
      </p>
      <PageHeader title={o.name} lead={[KIND_LABELS[o.kind], o.region].filter(Boolean).join(" · ")} />
      <div className="grid gap-6 lg:grid-cols-3">
        <Facts organisation={o} />
        <div className="space-y-6 lg:col-span-2">
          {account ? <OpenSpecs specs={account.openSpecs} /> : o.specs ? <Specs specs={o.specs} /> : null}
          {o.jobs ? <Jobs jobs={o.jobs} kind={o.kind} /> : null}
          {account ? <AccountPayments payments={account.payments} /> : null}
        </div>
      </div>
      {account ? (
        <div className="mt-6 grid gap-6 lg:grid-cols-3">
          <Card title="Who to contact">
            <OrganisationProfileCard profile={account.profile} />
            {account.profile.quoteContact ? null : (
              <p className="mt-2 text-sm text-ink-600">No contact for quotes given in their profile yet: the people below can all be reached.</p>
            )}
          </Card>
          <div className="lg:col-span-2">
            <AccountNotes notes={account.notes} answer={actionData} />
          </div>
        </div>
      ) : null}
      <Card title="People" className="mt-6">
        {o.people.length === 0 ? (
          <p className="text-sm text-ink-600">Nobody has joined yet.</p>
        ) : (
          <ListTable label="People" minWidth="min-w-[30rem]" columns={["Name", "E-mail", "Role", "Status", "Last signed in"]}>
            {o.people.map((u) => (
              <tr key={u.id} className="border-t border-ink-100">
                <td className="py-2 pr-3 font-semibold">{u.name}</td>
                <td className="pr-3 break-all">{u.email}</td>
                <td className="pr-3">{ROLE_LABELS[u.role]}</td>
                <td className="pr-3">
                  <ActiveBadge active={u.active} />
                </td>
                <td>{u.lastSignInAt ? formatMoment(u.lastSignInAt) : "Never"}</td>
              </tr>
            ))}
          </ListTable>
        )}
      </Card>
    </>
  );
}

function Facts({ organisation: o }: { organisation: OrganisationPage }) {
  return (
    <Card title="Who they are">
      <dl className="space-y-3 text-sm">
        <Fact label="Kind">{KIND_LABELS[o.kind]}</Fact>
        <Fact label="Region">{o.region ?? "Not given"}</Fact>
        <Fact label="On Tenderflow since">{formatDay(o.since)}</Fact>
        {o.approval ? (
          <Fact label="Approval">
            <Badge tone={APPROVAL_TONES[o.approval]}>{APPROVAL_LABELS[o.approval]}</Badge>
            {o.approvalDecidedAt ? <span className="block text-ink-600">Decided {formatDay(o.approvalDecidedAt)}</span> : null}
            {o.approval === "refused" && o.approvalReason ? <span className="block break-words text-ink-600">{o.approvalReason}</span> : null}
            {o.canDecideApproval && o.approval !== "approved" ? (
              <Link to="/admin/organisations" className="block text-flow-700 hover:underline">
                Decide on the Organisations page
              </Link>
            ) : null}
          </Fact>
        ) : null}
        {o.kind === "buyer" ? <Fact label="Account manager">{o.accountManager ?? "Nobody yet"}</Fact> : null}
      </dl>
    </Card>
  );
}

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-ink-600">{label}</dt>
      <dd className="font-semibold">{children}</dd>
    </div>
  );
}

/** One spec or job of the organisation: its title as a link, what stands beside it. */
function RecordRow({ to, title, children }: { to: string; title: string; children: React.ReactNode }) {
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 py-2">
      <Link to={to} className="font-semibold text-flow-700 hover:underline">
        {title || "Untitled spec"}
      </Link>
      <span className="flex flex-wrap items-center gap-2 text-ink-600">{children}</span>
    </li>
  );
}

function Specs({ specs }: { specs: NonNullable<OrganisationPage["specs"]> }) {
  return (
    <Card title={`Published specs (${specs.total})`}>
      {specs.recent.length === 0 ? (
        <p className="text-sm text-ink-600">Nothing published yet. Drafts stay with the buyer until they publish them.</p>
      ) : (
        <ul className="divide-y divide-ink-100 text-sm">
          {specs.recent.map((s) => (
            <RecordRow key={s.id} to={`/specs/${s.id}`} title={s.title}>
              {s.publishedAt ? `published ${formatDay(s.publishedAt)}` : null}
              <Badge tone={SPEC_STATUS_TONES[s.status]}>{SPEC_STATUS_LABELS[s.status]}</Badge>
            </RecordRow>
          ))}
        </ul>
      )}
      {specs.total > specs.recent.length ? <p className="mt-2 text-xs text-ink-600">The {specs.recent.length} published last.</p> : null}
    </Card>
  );
}

type JobsCard = NonNullable<Route.ComponentProps["loaderData"]["organisation"]["jobs"]>;

function Jobs({ jobs, kind }: { jobs: JobsCard; kind: OrganisationPage["kind"] }) {
  return (
    <Card title="Jobs">
      {jobs.recent.length === 0 ? (
        <p className="text-sm text-ink-600">
          {kind === "shop" ? "No job built by this shop yet." : "No awarded job yet. Jobs appear here when this account awards a bid."}
        </p>
      ) : (
        <>
          <ul className="divide-y divide-ink-100 text-sm">
            {jobs.recent.map((j) => (
              <RecordRow key={j.id} to={`/jobs/${j.id}`} title={j.specTitle}>
                <span>
                  {JOB_STAGE_LABELS[j.stage]} · {kind === "shop" ? j.buyerName : j.shopName}
                  {j.next?.targetDate ? ` · next: ${j.next.label} by ${formatDay(j.next.targetDate)}` : ""}
                  <AfterHandoverNote job={j} />
                </span>
                {j.overdue ? <OverdueBadge daysLate={j.daysLate} /> : null}
              </RecordRow>
            ))}
          </ul>
          <Link to={jobs.listLink} className="mt-3 inline-block text-sm text-flow-700 hover:underline">
            {jobs.total > jobs.recent.length ? `All ${countOf(jobs.total, "job")} →` : "In the job list →"}
          </Link>
        </>
      )}
    </Card>
  );
}
