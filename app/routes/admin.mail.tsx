import { parseWithZod } from "@conform-to/zod/v4";
import { Form, Link, data, useSearchParams } from "react-router";
import type { Route } from "./+types/admin.mail";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { formatMoment } from "~/content/dates";
import { Badge, Button, Card, ErrorNotice, ListTable, PageHeader, Pager, SortChoice } from "~/components/ui";
import { LIST_SORTS } from "~/schemas/list-sort";
import { mailListQuerySchema, sendAgainSchema } from "~/schemas/outbox";
import { fieldErrorsOf } from "~/services/errors.server";
import { MAX_ATTEMPTS } from "~/services/mail.server";
import { WAITING_LONG_MINUTES, backgroundWorkOverview, mailNeedingAttention, sendAgain, type MailView } from "~/services/outbox-admin.server";

export const meta: Route.MetaFunction = () => [{ title: "Mail · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const query = mailListQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const view: MailView = query.show ?? "failed";
  const [mail, background] = await Promise.all([mailNeedingAttention(admin, view, { page: query.page, sort: query.sort }), backgroundWorkOverview(admin)]);
  return { view, sort: query.sort, maxAttempts: MAX_ATTEMPTS, waitingMinutes: WAITING_LONG_MINUTES, background, ...mail };
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const submission = parseWithZod(await request.formData(), { schema: sendAgainSchema });
  if (submission.status !== "success") return data({ error: "Choose a mail to send again." }, { status: 400 });
  try {
    const mail = await sendAgain(admin, submission.value.mailId);
    const back = new URL(request.url);
    return redirectWithToast(request, `${back.pathname}${back.search}`, `The mail to ${mail.to} is queued again.`);
  } catch (error) {
    return data({ error: fieldErrorsOf(error).message }, { status: 409 });
  }
}

const VIEW_LABELS: Record<MailView, string> = { failed: "Failed", waiting: "Waiting too long", queued: "Queued now" };
const EMPTY: Record<MailView, string> = {
  failed: "No failed mail: everything queued has gone out or is still being tried.",
  waiting: "No mail has been waiting long.",
  queued: "Nothing is queued: every mail has gone out or failed.",
};

export default function AdminMail({ loaderData: d, actionData }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  return (
    <>
      <PageHeader
        title="Mail"
        lead={`Mail that did not go out (failed after ${d.maxAttempts} attempts, or queued more than ${d.waitingMinutes} minutes ago and still waiting) and all mail queued now. Sending again gives a mail ${d.maxAttempts} fresh attempts.`}
      />
      <ErrorNotice error={actionData?.error} />
      <Card>
        <nav aria-label="Which mail" className="mb-4 flex gap-2 text-sm">
          {(Object.keys(VIEW_LABELS) as MailView[]).map((view) => (
            <Link
              key={view}
              to={`?show=${view}&sort=${d.sort}`}
              aria-current={view === d.view ? "page" : undefined}
              className={`rounded-md px-3 py-1.5 ring-1 ${view === d.view ? "bg-flow-600 text-white ring-flow-600" : "ring-ink-200 hover:bg-ink-100"}`}
            >
              {VIEW_LABELS[view]} ({d.counts[view]})
            </Link>
          ))}
        </nav>
        {d.mails.length === 0 ? (
          <p className="py-6 text-center text-ink-600">{EMPTY[d.view]}</p>
        ) : (
          <>
            <SortChoice options={LIST_SORTS.mail} current={d.sort} search={searchParams} />
            <ListTable label="Mail queue" columns={["Recipient", "Subject", "Attempts", "Last error", "Queued", { label: "", srLabel: "Action" }]}>
              {d.mails.map((m) => (
                <tr key={m.id} className="border-t border-ink-100 align-top">
                  <td className="py-2 break-all">{m.to}</td>
                  <td className="break-words">{m.subject}</td>
                  <td>
                    {m.status === "failed" ? <Badge tone="bad">Failed</Badge> : <Badge tone="warn">Waiting</Badge>} {m.attempts}
                  </td>
                  <td className="max-w-xs break-words text-ink-600">
                    {m.lastError ? <span title={m.lastError}>{m.lastError.length > 160 ? `${m.lastError.slice(0, 160)}…` : m.lastError}</span> : "—"}
                    {m.lastTriedAt ? <span className="block text-xs">Last tried {formatMoment(m.lastTriedAt)}</span> : null}
                    {m.nextAttemptAt && m.attempts > 0 ? <span className="block text-xs">Next try {formatMoment(m.nextAttemptAt)}</span> : null}
                  </td>
                  <td className="whitespace-nowrap">{formatMoment(m.queuedAt)}</td>
                  <td>
                    <Form method="post">
                      <input type="hidden" name="intent" value="send-again" />
                      <input type="hidden" name="mailId" value={m.id} />
                      <Button type="submit" tone="secondary" className="px-2 py-1">
                        Send again
                      </Button>
                    </Form>
                  </td>
                </tr>
              ))}
            </ListTable>
          </>
        )}
        <Pager page={d.page} pageCount={d.pageCount} search={searchParams} />
      </Card>
      <BackgroundWork {...d.background} />
    </>
  );
}

/** The mail queued now and each scheduled job's last runs, so an admin sees the background work is alive. */
function BackgroundWork({ queued, schedules }: Route.ComponentProps["loaderData"]["background"]) {
  return (
    <Card className="mt-6" title="Background work">
      <p className="mb-3 text-sm text-ink-600">
        {queued === 0 ? (
          "No mail is queued: everything has gone out or failed."
        ) : (
          <>
            <Link to="?show=queued" className="text-flow-700 hover:underline">
              {queued} mail{queued === 1 ? " is" : "s are"} queued
            </Link>{" "}
            to go out, most urgent first.
          </>
        )}
      </p>
      <ListTable label="Scheduled work" columns={["Work", "Runs", "Last finished", "Last failed"]}>
        {schedules.map((s) => (
          <tr key={s.label} className="border-t border-ink-100 align-top [&>td]:py-2">
            <td>{s.label}</td>
            <td>{s.every}</td>
            <td className="whitespace-nowrap">{s.lastDoneAt ? formatMoment(s.lastDoneAt) : "Not in the last 12 hours"}</td>
            <td className="max-w-xs break-words text-ink-600">
              {s.lastFailedAt ? (
                <>
                  <Badge tone="bad">{formatMoment(s.lastFailedAt)}</Badge> {s.lastError}
                </>
              ) : (
                "—"
              )}
            </td>
          </tr>
        ))}
      </ListTable>
    </Card>
  );
}
