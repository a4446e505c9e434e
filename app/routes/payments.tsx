import { Form, Link, useSearchParams } from "react-router";
import type { Route } from "./+types/payments";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { Badge, Button, Card, EmptyState, FilterSelects, ListTable, PageHeader, type ListFilter } from "~/components/ui";
import { OrganisationName } from "~/components/organisation-link";
import { formatMoney } from "~/content/money";
import { formatMoment } from "~/content/dates";
import { PAYMENT_STATUSES, PAYMENT_STATUS_LABELS, PAYMENT_STATUS_TONES, type PaymentStatus } from "~/content/payment-status";
import { paymentListSchema } from "~/schemas/payments";
import { listPayments } from "~/services/payments.server";
import { openableOrganisations } from "~/services/organisation-page.server";

export const meta: Route.MetaFunction = () => [{ title: "Payments · Tenderflow" }];

const FILTERS: ListFilter[] = [
  { name: "status", label: "Status", any: "Any status", options: PAYMENT_STATUSES.map((s) => ({ value: s, label: PAYMENT_STATUS_LABELS[s] })) },
];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.payments);
  const query = paymentListSchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const { payments, total, page, pageCount } = await listPayments(user, query);
  const openable = await openableOrganisations(
    user,
    payments.flatMap((p) => [p.buyerOrganisationId, p.job.shopOrganisationId]),
  );
  return {
    role: user.role,
    total,
    page,
    pageCount,
    payments: payments.map((p) => ({
      id: p.id,
      jobId: p.jobId,
      specId: p.job.spec.id,
      specTitle: p.job.spec.title,
      buyer: { id: p.buyerOrganisationId, name: p.buyerOrganisation.name, linked: openable.includes(p.buyerOrganisationId) },
      shop: { id: p.job.shopOrganisationId, name: p.job.shopOrganisation.name, linked: openable.includes(p.job.shopOrganisationId) },
      purpose: p.purpose,
      status: p.status as PaymentStatus,
      amountCents: p.amountCents,
      refundedCents: p.refundedCents,
      currency: p.currency,
      createdAt: p.createdAt.toISOString(),
      paidAt: p.paidAt?.toISOString() ?? null,
      flag: p.flag,
      duplicate: p.duplicate,
    })),
  };
}

export default function Payments({ loaderData: d }: Route.ComponentProps) {
  const [params] = useSearchParams();
  return (
    <>
      <PageHeader
        title="Payments"
        lead={
          d.role === "buyer"
            ? "Every retainer and balance your organisation has paid or tried to pay by card."
            : d.role === "admin"
              ? "Every card payment on Tenderflow: retainers and balances."
              : "Card payments of the buyer accounts you follow: retainers and balances. A balance paid by bank transfer is on its job and account."
        }
      />
      <Card>
        <Form method="get" role="search" className="mb-4 flex flex-wrap items-center gap-2 text-sm">
          <FilterSelects filters={FILTERS} search={params} />
          <label className="flex items-center gap-2 py-1.5">
            <input type="checkbox" name="flagged" value="1" defaultChecked={params.get("flagged") === "1"} />
            <span className="font-semibold">Needs a check</span>
          </label>
          <Button type="submit" tone="secondary">
            Apply
          </Button>
        </Form>
        {d.payments.length === 0 ? (
          <EmptyState
            title={params.get("flagged") === "1" ? "No payment needs a check" : params.get("status") ? "No payment has that status" : "No payments yet"}
          >
            <p>The retainer is paid by card after a bid is awarded, the balance after the handover; each attempt is listed here with its status.</p>
          </EmptyState>
        ) : (
          <ListTable
            label="Payments"
            pager={{ page: d.page, pageCount: d.pageCount, search: params }}
            columns={[
              "Job",
              "Buyer",
              "Shop",
              "For",
              "Status",
              { label: "Amount", className: "text-right" },
              { label: "Paid back", className: "text-right" },
              "Started",
              "Paid",
            ]}
          >
            {d.payments.map((p) => (
              <tr key={p.id} className="border-t border-ink-100 align-top">
                <td className="py-2 pr-3">
                  <Link to={`/jobs/${p.jobId}`} className="font-semibold text-flow-700 hover:underline">
                    {p.specTitle}
                  </Link>
                  <Link to={`/specs/${p.specId}`} className="block text-xs text-ink-600 hover:underline">
                    the spec
                  </Link>
                </td>
                <td className="py-2 pr-3">
                  <OrganisationName {...p.buyer} />
                </td>
                <td className="py-2 pr-3">
                  <OrganisationName {...p.shop} />
                </td>
                <td className="py-2 pr-3">{p.purpose === "balance" ? "Balance" : "Retainer"}</td>
                <td className="py-2 pr-3">
                  <span className="flex flex-wrap gap-1">
                    <Badge tone={PAYMENT_STATUS_TONES[p.status]}>{PAYMENT_STATUS_LABELS[p.status]}</Badge>
                    {p.duplicate ? <Badge tone="warn">Second charge</Badge> : null}
                    {p.flag ? <Badge tone="bad">Needs a check</Badge> : null}
                  </span>
                  {p.flag ? (
                    <p className="mt-1 max-w-xs whitespace-pre-line text-xs text-alarm-600" data-testid="payment-flag">
                      {p.flag}
                    </p>
                  ) : null}
                </td>
                <td className="py-2 pr-3 text-right tabular-nums">{formatMoney(p.amountCents, p.currency)}</td>
                <td className="py-2 pr-3 text-right tabular-nums">{p.refundedCents ? formatMoney(p.refundedCents, p.currency) : "—"}</td>
                <td className="py-2 pr-3">{formatMoment(p.createdAt)}</td>
                <td className="py-2">{p.paidAt ? formatMoment(p.paidAt) : "—"}</td>
              </tr>
            ))}
          </ListTable>
        )}
      </Card>
    </>
  );
}
