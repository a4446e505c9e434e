import { parseWithZod } from "@conform-to/zod/v4";
import { Form, data, useSearchParams } from "react-router";
import type { Route } from "./+types/admin.organisations";
import { requireRole } from "~/auth/permissions.server";
import { KIND_LABELS, ORGANISATION_KINDS, PAGE_ROLES } from "~/auth/roles";
import { redirectWithToast } from "~/auth/session.server";
import { Badge, Button, Card, ErrorNotice, FilterSelects, ListTable, type ListFilter, PageHeader, RowChoiceForm, SearchBar, SortChoice } from "~/components/ui";
import { OrganisationName } from "~/components/organisation-link";
import { countOf } from "~/content/count";
import { formatDay } from "~/content/dates";
import { APPROVALS, APPROVAL_LABELS, APPROVAL_TONES, REFUSAL_REASON_MAX, type Approval } from "~/content/shop-approval";
import { assignManagerSchema, organisationListQuerySchema } from "~/schemas/admin";
import { LIST_SORTS } from "~/schemas/list-sort";
import { shopDecisionSchema } from "~/schemas/shop-approval";
import { assignAccountManager, listAccountManagers, listOrganisations } from "~/services/admin.server";
import { fieldErrorsOf } from "~/services/errors.server";
import { openableOrganisations } from "~/services/organisation-page.server";
import { countWaitingShops, decideShop, shopsAwaitingApproval } from "~/services/shop-approval.server";

const FILTERS: ListFilter[] = [
  { name: "kind", label: "Kind", any: "All kinds", options: ORGANISATION_KINDS.map((k) => ({ value: k, label: KIND_LABELS[k] })) },
  { name: "approval", label: "Approval", any: "Any approval", options: APPROVALS.map((a) => ({ value: a, label: APPROVAL_LABELS[a] })) },
];

export const meta: Route.MetaFunction = () => [{ title: "Organisations · Tenderflow" }];

export async function loader({ request }: Route.LoaderArgs) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const query = organisationListQuerySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const [{ organisations, total, page, pageCount }, managers, waiting, waitingTotal] = await Promise.all([
    listOrganisations(admin, query),
    listAccountManagers(admin),
    shopsAwaitingApproval(admin),
    countWaitingShops(admin),
  ]);
  const openable = await openableOrganisations(admin, [...organisations.map((o) => o.organisation.id), ...waiting.map((w) => w.id)]);
  return {
    sort: query.sort,
    total,
    page,
    pageCount,
    waiting: waiting.map((w) => ({ ...w, linked: openable.includes(w.id) })),
    waitingTotal,
    managers: managers.map((m) => ({ id: m.id, name: m.name })),
    organisations: organisations.map(({ organisation: o, memberCount }) => ({
      id: o.id,
      name: o.name,
      kind: o.kind,
      region: o.region,
      memberCount,
      accountManagerId: o.accountManagerId ?? "",
      approval: o.approval as Approval | null,
      approvalReason: o.approvalReason as string | null,
      linked: openable.includes(o.id),
    })),
  };
}

type ActionResult = { error: string; organisationId?: string };

/** Approving or refusing a shop (intent "approve" / "refuse"), or assigning an account manager. */
async function decide(request: Request, formData: FormData) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const submission = parseWithZod(formData, { schema: shopDecisionSchema });
  const organisationId = String(formData.get("organisationId") ?? "");
  if (submission.status !== "success") {
    const error = Object.values(submission.error ?? {}).flat()[0] ?? "That decision was not understood.";
    return data<ActionResult>({ error, organisationId }, { status: 400 });
  }
  const choice = submission.value;
  try {
    const shop = await decideShop(
      admin,
      choice.organisationId,
      choice.intent === "approve" ? { decision: "approve" } : { decision: "refuse", reason: choice.reason },
    );
    const back = new URL(request.url);
    return redirectWithToast(
      request,
      `${back.pathname}${back.search}`,
      shop.approval === "approved"
        ? `${shop.name} is approved and can read specs now; its people have been e-mailed.`
        : `${shop.name} is refused; its people have been e-mailed the reason.`,
    );
  } catch (error) {
    return data<ActionResult>({ error: fieldErrorsOf(error).message, organisationId }, { status: 400 });
  }
}

export async function action({ request }: Route.ActionArgs) {
  const admin = await requireRole(request, PAGE_ROLES.administration);
  const formData = await request.formData();
  if (formData.has("intent")) return decide(request, formData);
  const submission = parseWithZod(formData, { schema: assignManagerSchema });
  if (submission.status !== "success") return data<ActionResult>({ error: "Choose an account manager." }, { status: 400 });
  try {
    await assignAccountManager(admin, submission.value.organisationId, submission.value);
  } catch (error) {
    return data<ActionResult>({ error: fieldErrorsOf(error).message }, { status: 400 });
  }
  const back = new URL(request.url);
  return redirectWithToast(request, `${back.pathname}${back.search}`, "Account manager saved.");
}

function ApproveButton({ organisationId, name }: { organisationId: string; name: string }) {
  return (
    <Form method="post">
      <input type="hidden" name="intent" value="approve" />
      <input type="hidden" name="organisationId" value={organisationId} />
      <Button type="submit" className="px-3 py-1" aria-label={`Approve ${name}`}>
        Approve
      </Button>
    </Form>
  );
}

/** Shops that signed up and read nothing until an admin decides. */
function WaitingShops({
  waiting,
  total,
  actionData,
}: {
  waiting: Route.ComponentProps["loaderData"]["waiting"];
  total: number;
  actionData: ActionResult | undefined;
}) {
  return (
    <Card className="mb-6">
      <h2 className="font-semibold">
        Waiting for approval{total > 0 ? ` (${total})` : ""}
        {total > waiting.length ? <span className="font-normal text-ink-600"> · the {waiting.length} that have waited longest</span> : null}
      </h2>
      <p className="mb-3 text-sm text-ink-600">
        These shops signed up and can read no spec until you approve them. Check that each is a real fluid-power business; a refusal needs a reason, which the
        shop reads. Either way, the shop is e-mailed.
      </p>
      {waiting.length === 0 ? <p className="py-2 text-sm text-ink-600">No shop is waiting.</p> : null}
      <ul className="divide-y divide-ink-100">
        {waiting.map((shop) => {
          const problem = actionData?.organisationId === shop.id ? actionData.error : null;
          return (
            <li key={shop.id} className="grid gap-3 py-3 text-sm md:grid-cols-[1fr_auto]">
              <div>
                <OrganisationName id={shop.id} name={shop.name} linked={shop.linked} className="font-semibold" />
                <p className="text-ink-600">Signed up {formatDay(shop.signedUpAt)}</p>
                <ul className="text-ink-600">
                  {shop.people.map((p) => (
                    <li key={p.email} className="break-all">
                      {p.name} · {p.email}
                    </li>
                  ))}
                </ul>
              </div>
              <div className="flex flex-wrap items-start gap-2">
                <ApproveButton organisationId={shop.id} name={shop.name} />
                <Form method="post" className="flex flex-col gap-1">
                  <input type="hidden" name="intent" value="refuse" />
                  <input type="hidden" name="organisationId" value={shop.id} />
                  <label htmlFor={`reason-${shop.id}`} className="sr-only">
                    Why {shop.name} is refused
                  </label>
                  <textarea
                    id={`reason-${shop.id}`}
                    name="reason"
                    required
                    rows={2}
                    maxLength={REFUSAL_REASON_MAX}
                    placeholder="Why it is refused (the shop reads this)"
                    aria-invalid={problem ? true : undefined}
                    aria-describedby={problem ? `reason-${shop.id}-problem` : undefined}
                    className="w-64 rounded-md px-2 py-1 ring-1 ring-ink-200 aria-[invalid=true]:ring-alarm-600"
                  />
                  {problem ? (
                    <span id={`reason-${shop.id}-problem`} className="text-xs font-semibold text-alarm-600">
                      {problem}
                    </span>
                  ) : null}
                  <Button type="submit" tone="danger" className="self-start px-3 py-1">
                    Refuse
                  </Button>
                </Form>
              </div>
            </li>
          );
        })}
      </ul>
    </Card>
  );
}

export default function AdminOrganisations({ loaderData, actionData }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  return (
    <>
      <PageHeader title="Organisations" lead={`${countOf(loaderData.total, "organisation")}.`} />
      <WaitingShops waiting={loaderData.waiting} total={loaderData.waitingTotal} actionData={actionData} />
      <ErrorNotice error={loaderData.waiting.some((w) => w.id === actionData?.organisationId) ? null : actionData?.error} />
      <Card>
        <SearchBar label="Search organisations" placeholder="Organisation name" value={searchParams.get("q") ?? ""}>
          <FilterSelects filters={FILTERS} search={searchParams} />
          <input type="hidden" name="sort" value={loaderData.sort} />
        </SearchBar>
        <SortChoice options={LIST_SORTS.organisations} current={loaderData.sort} search={searchParams} />
        <ListTable
          label="Organisations"
          pager={{ page: loaderData.page, pageCount: loaderData.pageCount, search: searchParams }}
          empty="No organisation matches that search."
          columns={["Organisation", "Kind", "Region", "Users", "Approval", "Account manager"]}
        >
          {loaderData.organisations.map((o) => (
            <tr key={o.id} className="border-t border-ink-100">
              <td className="py-2 pr-3 font-semibold">
                <OrganisationName id={o.id} name={o.name} linked={o.linked} />
              </td>
              <td>{KIND_LABELS[o.kind]}</td>
              <td>{o.region ?? "—"}</td>
              <td>{o.memberCount}</td>
              <td>
                {o.approval ? (
                  <div className="flex flex-col items-start gap-1 py-1">
                    <Badge tone={APPROVAL_TONES[o.approval]}>{APPROVAL_LABELS[o.approval]}</Badge>
                    {o.approval === "refused" ? (
                      <>
                        {o.approvalReason ? <span className="max-w-xs text-xs break-words text-ink-600">{o.approvalReason}</span> : null}
                        <ApproveButton organisationId={o.id} name={o.name} />
                      </>
                    ) : null}
                  </div>
                ) : (
                  <span className="text-ink-400">—</span>
                )}
              </td>
              <td>
                {o.kind === "buyer" ? (
                  <RowChoiceForm
                    id={`manager-${o.id}`}
                    name="managerId"
                    label={`Account manager of ${o.name}`}
                    value={o.accountManagerId}
                    options={[{ value: "", label: "Nobody yet" }, ...loaderData.managers.map((m) => ({ value: m.id, label: m.name }))]}
                    fields={{ organisationId: o.id }}
                  />
                ) : (
                  <span className="text-ink-400">—</span>
                )}
              </td>
            </tr>
          ))}
        </ListTable>
      </Card>
    </>
  );
}
