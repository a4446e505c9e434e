import { Form, Link, useSearchParams } from "react-router";
import { formatDay } from "~/content/dates";
import { z } from "zod";
import type { Route } from "./+types/specs";
import { requireRole } from "~/auth/permissions.server";
import { PAGE_ROLES } from "~/auth/roles";
import { SPEC_STATUSES, SPEC_STATUS_LABELS, SPEC_STATUS_TONES, shownSpecStatus, type SpecStatus } from "~/content/spec-status";
import { Badge, Button, Card, EmptyState, PageHeader, TableScroll } from "~/components/ui";
import { ColumnHeads } from "~/components/column-heads";

import { SPEC_SORTS, listSpecs } from "~/services/specs.server";
import { offerCounts } from "~/services/bids.server";
import { waitingQuestionCounts } from "~/services/questions.server";

export const meta: Route.MetaFunction = () => [{ title: "My specs · Tenderflow" }];

const querySchema = z.object({
  status: z.enum(SPEC_STATUSES).optional().catch(undefined),
  sort: z
    .enum(Object.keys(SPEC_SORTS) as [keyof typeof SPEC_SORTS])
    .optional()
    .catch(undefined),
});

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireRole(request, PAGE_ROLES.ownSpecs);
  const query = querySchema.parse(Object.fromEntries(new URL(request.url).searchParams));
  const specs = await listSpecs(user, query);
  const published = specs.filter((s) => s.status !== "draft").map((s) => s.id);
  const [offers, waiting] = await Promise.all([offerCounts(published), waitingQuestionCounts(user, published)]);
  return {
    organisationName: user.organisation.name,
    filtered: Boolean(query.status),
    specs: specs.map((s) => ({
      id: s.id,
      title: s.title,
      status: shownSpecStatus(s.status as SpecStatus, s.bidDeadline),
      offers: s.status === "draft" ? null : (offers.get(s.id) ?? 0),
      waitingQuestions: waiting.get(s.id) ?? 0,
      revision: s.currentRevision,
      bidDeadline: s.bidDeadline?.toISOString() ?? null,
      updatedAt: s.updatedAt.toISOString(),
    })),
  };
}

const NewSpecButton = () => (
  <Form method="post" action="/specs/new">
    <Button type="submit">Start a new spec</Button>
  </Form>
);

export default function Specs({ loaderData }: Route.ComponentProps) {
  const [searchParams] = useSearchParams();
  const { specs } = loaderData;
  return (
    <>
      <PageHeader
        title="My specs"
        lead={`Hydraulic axes that ${loaderData.organisationName} has described for quotation.`}
        actions={specs.length || loaderData.filtered ? <NewSpecButton /> : null}
      />
      {specs.length === 0 && !loaderData.filtered ? (
        <EmptyState title="No specs yet" action={<NewSpecButton />}>
          <p>
            A spec describes one hydraulic axis of your machine: what it moves, how far, how fast and how often. Tenderflow sizes a preliminary circuit from it,
            and fluid-power shops bid against the same bill of materials.
          </p>
          <p className="mt-3">Have the moving mass, the stroke and the speeds at hand: those are the first things the spec asks for.</p>
        </EmptyState>
      ) : (
        <Card>
          <Form method="get" className="mb-4 flex flex-wrap items-end gap-3 text-sm">
            <label>
              <span className="block font-semibold">Status</span>
              <select name="status" defaultValue={searchParams.get("status") ?? ""} className="rounded-md px-2 py-1.5 ring-1 ring-ink-200">
                <option value="">All</option>
                {SPEC_STATUSES.map((s) => (
                  <option key={s} value={s}>
                    {SPEC_STATUS_LABELS[s]}
                  </option>
                ))}
              </select>
            </label>
            <label>
              <span className="block font-semibold">Sort by</span>
              <select name="sort" defaultValue={searchParams.get("sort") ?? "updated"} className="rounded-md px-2 py-1.5 ring-1 ring-ink-200">
                <option value="updated">Last changed</option>
                <option value="deadline">Bid deadline</option>
                <option value="title">Title</option>
              </select>
            </label>
            <Button type="submit" tone="secondary">
              Apply
            </Button>
          </Form>
          {specs.length === 0 ? (
            <p className="py-6 text-center text-ink-600">No spec has that status.</p>
          ) : (
            <TableScroll label="Specs">
              <table className="w-full min-w-[40rem] text-left text-sm">
                <thead className="text-ink-600">
                  <ColumnHeads heads={[["Spec", "py-2"], "Status", ["Offers", "text-right pr-4"], "Bid deadline", "Last changed"]} />
                </thead>
                <tbody>
                  {specs.map((s) => (
                    <tr key={s.id} className="border-t border-ink-100">
                      <td className="max-w-[24rem] py-2 pr-4 [overflow-wrap:anywhere]">
                        <Link to={s.status === "draft" ? `/specs/${s.id}/edit` : `/specs/${s.id}`} className="font-semibold text-flow-700 hover:underline">
                          {s.title || "Untitled draft"}
                        </Link>
                        {s.revision > 1 ? <span className="ml-2 text-xs text-ink-400">revision {s.revision}</span> : null}
                        {s.waitingQuestions ? (
                          <Link
                            to={`/specs/${s.id}#questions`}
                            className="mt-1 block w-fit text-xs font-semibold text-signal-700 hover:underline"
                            data-waiting-questions={s.waitingQuestions}
                          >
                            {s.waitingQuestions} question{s.waitingQuestions === 1 ? "" : "s"} waiting for your answer
                          </Link>
                        ) : null}
                      </td>
                      <td>
                        <Badge tone={SPEC_STATUS_TONES[s.status]}>{SPEC_STATUS_LABELS[s.status]}</Badge>
                      </td>
                      <td className="pr-4 text-right tabular-nums">
                        {s.offers ? (
                          <Link to={`/specs/${s.id}/bids`} className="font-semibold text-flow-700 hover:underline">
                            {s.offers}
                          </Link>
                        ) : s.offers === 0 ? (
                          "0"
                        ) : (
                          "—"
                        )}
                      </td>
                      <td>{s.bidDeadline ? formatDay(s.bidDeadline) : "—"}</td>
                      <td>{formatDay(s.updatedAt)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableScroll>
          )}
        </Card>
      )}
    </>
  );
}
