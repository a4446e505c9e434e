import { Form, Link, useSearchParams } from "react-router";
import { formatDay } from "~/content/dates";
import type { Route } from "./+types/spec";
import { requireUser } from "~/auth/permissions.server";
import { can, viewerOf } from "~/auth/access-policy.server";
import { specBackLink } from "~/auth/navigation";
import { PublishedReport } from "~/components/design-report";
import type { LazyDetail } from "~/components/folded-section";
import { Badge, Button, ButtonLink, Notice, PageHeader } from "~/components/ui";
import { SPEC_STATUS_LABELS, SPEC_STATUS_TONES, shownSpecStatus, type SpecStatus } from "~/content/spec-status";
import { QuotationPanel } from "~/components/quotation-facts";
import { QuestionsPanel } from "~/components/questions-panel";
import { quotationFacts } from "~/content/quotation-facts";
import { listAttachments } from "~/services/attachments.server";
import { questionsFor } from "~/services/questions.server";
import { buyerNameFor, specForReader } from "~/services/spec-access.server";
import { designOfRevision, revisionsOf } from "~/services/specs.server";
import { biddingPanelOf } from "~/services/bids.server";
import { BidPanel } from "~/components/bid-panel";
import { DETAIL_PARTS, summaryOf, type DetailPart } from "~/services/published-design";
import { publishedDetailHtml } from "~/services/published-detail.server";
import type { UnitSystem } from "~/units";

export const meta: Route.MetaFunction = ({ data: d }) => [{ title: `${d?.title ?? "Spec"} · Tenderflow` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const spec = await specForReader(user, params.specId);
  const revisions = await revisionsOf(spec);
  // Earlier revisions stay viewable: ?revision=N, the newest by default.
  const asked = Number(new URL(request.url).searchParams.get("revision"));
  const current = revisions.find((r) => r.number === asked) ?? revisions[0];
  const published = await designOfRevision(current);
  // The bill or the trail, asked for when the reader opens it (a fetcher, or the link without JavaScript).
  const part = DETAIL_PARTS.find((p) => p === new URL(request.url).searchParams.get("detail"));
  // Files, quotation facts and questions: for every reader of a published spec.
  const [attachments, questions, bidding] = await Promise.all([
    listAttachments(user, spec.id),
    spec.status === "draft" ? null : questionsFor(user, spec.id),
    biddingPanelOf(user, spec),
  ]);
  return {
    bidding,
    id: spec.id,
    title: spec.title,
    status: shownSpecStatus(spec.status as SpecStatus, spec.bidDeadline),
    // The buyer's own people: they edit and revise it (and are not told whose spec it is).
    isOwner: can(await viewerOf(user), "spec.edit", spec),
    // Named by the same rule as the bill workbook: never to a shop.
    buyerName: await buyerNameFor(user, spec),
    bidDeadline: spec.bidDeadline?.toISOString() ?? null,
    deliveryRegion: spec.deliveryRegion,
    retainerPercent: spec.retainerPercent,
    revision: current ? { number: current.number, engineVersion: current.engineVersion, createdAt: current.createdAt.toISOString() } : null,
    latestRevision: revisions[0]?.number ?? 0,
    revisions: revisions.map((r) => ({ number: r.number, createdAt: r.createdAt.toISOString() })),
    revising: spec.revising,
    // One axis or a machine of several, without the long detail until it is opened.
    published: published && summaryOf(published),
    detail: current && published && part ? { part, html: publishedDetailHtml(current.id, part, published) } : null,
    unitSystem: (user.unitSystem ?? "metric") as UnitSystem,
    quotation: current ? quotationFacts(current.answers) : null,
    attachments,
    questions,
    back: specBackLink(user, spec),
  };
}

/** Where the folded bill and trail load from: this page asked for that part of the revision shown. */
function lazyDetail(d: Route.ComponentProps["loaderData"]): Record<DetailPart, LazyDetail> {
  const at = (part: DetailPart) => {
    const query = new URLSearchParams({ ...(d.revision && d.revision.number < d.latestRevision ? { revision: String(d.revision.number) } : {}), detail: part });
    return { href: `/specs/${d.id}?${query}`, html: d.detail?.part === part ? d.detail.html : null };
  };
  return { bill: at("bill"), trail: at("trail") };
}

export default function SpecPage({ loaderData: d }: Route.ComponentProps) {
  const [params] = useSearchParams();
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={d.back.to} className="text-flow-700 hover:underline">
          ← {d.back.label}
        </Link>
      </p>
      <PageHeader
        title={d.title || "Untitled draft"}
        lead={
          <span className="flex flex-wrap items-center gap-x-4 gap-y-1">
            <Badge tone={SPEC_STATUS_TONES[d.status]}>{SPEC_STATUS_LABELS[d.status]}</Badge>
            {d.buyerName && !d.isOwner ? <span>For {d.buyerName}</span> : null}
            {d.revision ? (
              <span>
                Revision {d.revision.number}, sizing engine {d.revision.engineVersion}
              </span>
            ) : null}
            {d.bidDeadline ? <span>Bids until {formatDay(d.bidDeadline)}</span> : null}
            {d.deliveryRegion ? <span>Delivered to {d.deliveryRegion}</span> : null}
          </span>
        }
        actions={
          d.isOwner && d.status === "open" ? (
            d.revising ? (
              <Link to={`/specs/${d.id}/edit`} className="rounded-md bg-flow-600 px-4 py-2 text-sm font-semibold text-white">
                Continue revision {d.latestRevision + 1}
              </Link>
            ) : (
              <Form method="post" action={`/specs/${d.id}/revise`}>
                <Button type="submit" tone="secondary">
                  Revise this spec
                </Button>
              </Form>
            )
          ) : d.isOwner && d.status === "draft" ? (
            <>
              <Link to={`/specs/${d.id}/edit`} className="rounded-md bg-flow-600 px-4 py-2 text-sm font-semibold text-white">
                Continue the draft
              </Link>
              <Form method="post" action={`/specs/${d.id}/delete`}>
                <Button tone="danger" type="submit">
                  Delete draft
                </Button>
              </Form>
            </>
          ) : d.questions?.canAsk ? (
            // The question box sits below the whole design: a shop reading from the top finds it here.
            <ButtonLink to="#ask-question" tone="secondary">
              Ask a question
            </ButtonLink>
          ) : null
        }
      />
      {params.get("published") ? (
        <div className="mb-6">
          <Notice tone="good">Published. Fluid-power shops have been told and can bid until the deadline.</Notice>
        </div>
      ) : null}
      {d.questions?.canAnswer && d.questions.questions.some((q) => !q.answer) ? (
        <div className="mb-6">
          <Notice tone="warn">
            {(() => {
              const n = d.questions.questions.filter((q) => !q.answer).length;
              return `${n} question${n === 1 ? "" : "s"} from shops ${n === 1 ? "waits" : "wait"} for your answer; every shop sees the answers. `;
            })()}
            <a href="#questions" className="font-semibold underline">
              Answer now
            </a>
          </Notice>
        </div>
      ) : null}
      {d.revision ? <BidPanel specId={d.id} latestRevision={d.latestRevision} {...d.bidding} /> : null}
      {d.revisions.length > 1 ? (
        <nav aria-label="Revisions" className="mb-6 flex flex-wrap items-center gap-2 text-sm">
          <span className="text-ink-600">Revisions:</span>
          {d.revisions.map((r) => (
            <Link
              key={r.number}
              to={`?revision=${r.number}`}
              aria-current={r.number === d.revision?.number ? "page" : undefined}
              className={`rounded-md px-2 py-1 ring-1 ${r.number === d.revision?.number ? "bg-flow-600 text-white ring-flow-600" : "ring-ink-200 hover:bg-ink-100"}`}
            >
              {r.number} · {formatDay(r.createdAt)}
            </Link>
          ))}
        </nav>
      ) : null}
      {d.revision && d.revision.number < d.latestRevision ? (
        <div className="mb-6">
          <Notice tone="warn">
            You are looking at revision {d.revision.number}; revision {d.latestRevision} is the current one.
          </Notice>
        </div>
      ) : null}
      {d.quotation ? (
        <div className="mb-6">
          <QuotationPanel facts={d.quotation} attachments={d.attachments} />
        </div>
      ) : null}
      {d.published && d.revision ? (
        <p className="mb-3 flex justify-end">
          {/* A resource route: the browser downloads it, so no client-side navigation. */}
          <ButtonLink
            to={`/specs/${d.id}/bill.xlsx${d.revision.number < d.latestRevision ? `?revision=${d.revision.number}` : ""}`}
            reloadDocument
            tone="secondary"
          >
            Download the bill of materials (XLSX)
          </ButtonLink>
        </p>
      ) : null}
      {d.published ? (
        <div className="space-y-6">
          <PublishedReport published={d.published} units={d.unitSystem} componentsTitle="Bill of materials" lazy={lazyDetail(d)} />
        </div>
      ) : (
        <Notice>This draft has not been published yet, so it has no frozen design.</Notice>
      )}
      {d.questions ? (
        <div className="mt-6">
          <QuestionsPanel specId={d.id} panel={d.questions} />
        </div>
      ) : null}
    </>
  );
}
