import { Form, useActionData } from "react-router";
import type { OfferDocumentsReply } from "~/routes/spec-bid-documents";
import type { AttachmentView } from "~/services/attachments.server";
import { ACCEPTED_KINDS_TEXT, ACCEPT_ATTRIBUTE } from "~/services/file-types";
import { formatBytes } from "./attachment-uploader";
import { FieldErrors } from "./form-field";
import { Button, Card } from "./ui";

/** A document as a download, with its kind and size. */
export function DocumentLink({ doc, stacked = false }: { doc: AttachmentView; stacked?: boolean }) {
  return (
    <>
      <a href={doc.downloadUrl} download className="font-semibold text-flow-700 hover:underline">
        {doc.fileName}
      </a>
      <span className={`text-ink-600 ${stacked ? "block" : ""}`}>
        {doc.kindLabel} · {formatBytes(doc.sizeBytes)}
      </span>
    </>
  );
}

// The shop's own documents on its offer: a plain multipart form (it works without JavaScript),
// each document a download and, while the spec takes bids, removable. A refusal comes back as the
// bid page drawn by the documents route, its message beside the upload field.
export function OfferDocumentsCard({
  specId,
  documents,
  canChange,
  saved,
}: {
  specId: string;
  documents: AttachmentView[];
  canChange: boolean;
  saved: boolean;
}) {
  const action = `/specs/${specId}/bid/documents`;
  const page = useActionData() as Partial<OfferDocumentsReply> | undefined;
  const problems = page?.form === "offer-documents" ? Object.values(page.errors ?? {}).flat() : [];
  const problem = problems.length ? (
    <div role="alert" className="basis-full">
      <FieldErrors id="offer-documents-error" errors={problems} />
    </div>
  ) : null;
  return (
    <Card className="mt-6">
      <h2 id="offer-documents" className="mb-1 scroll-mt-4 text-lg font-semibold">
        Documents with your offer
      </h2>
      <p className="mb-3 text-sm text-ink-600">
        Your quotation, datasheets or drawings ({ACCEPTED_KINDS_TEXT}, up to 10 MB each, 10 in all). The buyer sees them beside your offer once it is submitted.
      </p>
      {documents.length ? (
        <ul className="mb-4 space-y-2 text-sm" data-testid="offer-documents">
          {documents.map((doc) => (
            <li key={doc.id} className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <DocumentLink doc={doc} />
              {canChange ? (
                <Form method="post" action={action} reloadDocument>
                  <input type="hidden" name="documentId" value={doc.id} />
                  <Button type="submit" tone="secondary" aria-label={`Remove ${doc.fileName}`}>
                    Remove
                  </Button>
                </Form>
              ) : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mb-4 text-sm text-ink-600">No documents yet.</p>
      )}
      {canChange ? null : problem}
      {canChange ? (
        <Form method="post" action={`${action}#offer-documents`} encType="multipart/form-data" reloadDocument className="flex flex-wrap items-center gap-3">
          <label className="text-sm">
            <span className="sr-only">Files to attach to your offer</span>
            <input
              type="file"
              name="files"
              multiple
              accept={ACCEPT_ATTRIBUTE}
              required
              className="text-sm"
              aria-invalid={problem ? true : undefined}
              aria-describedby={problem ? "offer-documents-error" : undefined}
            />
          </label>
          <Button type="submit" tone="secondary">
            Attach to the offer
          </Button>
          {problem}
        </Form>
      ) : saved ? null : (
        <p className="text-sm text-ink-600">Save your bid (a draft will do) to attach documents.</p>
      )}
    </Card>
  );
}
