import { Op } from "sequelize";
import { Bid, sequelize, type User } from "~/models/index.server";
import { BidDocument } from "~/models/bid.server";
import { offerDocumentsWhere, viewerOf } from "~/auth/access-policy.server";
import { ATTACHMENT_LIMITS, storedFileView, type AttachmentView } from "./attachments.server";
import { FieldErrors, notFound, requireId } from "./errors.server";
import { FILE_KINDS, type FileKind } from "./file-types";
import { discardStaged, receiveJobUpload } from "./job-files.server";
import { bidOfShop } from "./bids.server";
import { specFor } from "./spec-access.server";
import { fileStorage, readingStorage } from "./storage.server";
import { takesBids } from "~/content/spec-status";

// A shop's own documents on its offer (its quotation PDF, datasheets, drawings), on the spec
// drawings' rules: kinds known by their first bytes, 10 MB a file, 10 on an offer, all of an
// upload or none. The shop adds and removes them while the spec takes bids; the spec's buyer,
// the buyer's account manager and admins read them once the offer is made (offerDocumentsWhere).

export type OfferDocumentView = AttachmentView;

const ALL_KINDS = Object.keys(FILE_KINDS) as FileKind[];

const documentUrl = (specId: string, bidId: string, documentId: string) => `/specs/${specId}/bids/${bidId}/documents/${documentId}`;

const toView = (specId: string, row: BidDocument): OfferDocumentView => storedFileView(row, documentUrl(specId, row.bidId, row.id));

/** The documents of several bids of one spec, by bid id, oldest first. */
export async function documentsOfBids(specId: string, bidIds: string[]): Promise<Record<string, OfferDocumentView[]>> {
  const rows = bidIds.length
    ? await BidDocument.findAll({
        where: { bidId: bidIds },
        order: [
          ["createdAt", "ASC"],
          ["fileName", "ASC"],
        ],
      })
    : [];
  const byBid: Record<string, OfferDocumentView[]> = Object.fromEntries(bidIds.map((id) => [id, []]));
  for (const row of rows) byBid[row.bidId].push(toView(specId, row));
  return byBid;
}

/** The shop's bid on a spec it may still change, or a refusal in words. */
async function ownOpenBid(user: User, specId: string | undefined) {
  const spec = await specFor(user, specId, "spec.bid");
  if (!takesBids(spec)) throw new FieldErrors({ files: ["This spec no longer takes bids, so the documents of your offer can't be changed."] });
  const bid = await bidOfShop(user, spec);
  if (!bid) throw new FieldErrors({ files: ["Save your bid first (a draft will do), then attach its documents."] });
  return { spec, bid };
}

/** Attaches the files of a multipart upload ("files") to the shop's bid: all of them or none. */
export async function uploadOfferDocuments(user: User, specId: string | undefined, request: Request): Promise<string[]> {
  const { bid } = await ownOpenBid(user, specId);
  const { staged } = await receiveJobUpload(request, () => ALL_KINDS, "bid-documents");
  if (staged.length === 0) throw new FieldErrors({ files: ["Choose at least one PDF, PNG, JPEG, DXF or STEP file."] });
  let committed = false;
  try {
    await sequelize.transaction(async (transaction) => {
      // The bid row locked, so two uploads from two tabs count each other's files.
      await Bid.findByPk(bid.id, { lock: transaction.LOCK.UPDATE, transaction, rejectOnEmpty: true });
      const held = await BidDocument.count({ where: { bidId: bid.id }, transaction });
      if (held + staged.length > ATTACHMENT_LIMITS.maxFilesPerSpec) {
        const room = Math.max(ATTACHMENT_LIMITS.maxFilesPerSpec - held, 0);
        throw new FieldErrors({
          files: [
            `An offer holds at most ${ATTACHMENT_LIMITS.maxFilesPerSpec} documents; ${room ? `only ${room} more fit` : "remove one first"}. Nothing was attached.`,
          ],
        });
      }
      await BidDocument.bulkCreate(
        staged.map((f) => ({
          bidId: bid.id,
          fileName: f.fileName,
          contentType: f.contentType,
          storageKey: f.storageKey,
          sizeBytes: f.sizeBytes,
          uploadedById: user.id,
        })),
        { transaction },
      );
    });
    committed = true;
  } finally {
    if (!committed) await discardStaged(staged);
  }
  return staged.map((f) => f.fileName);
}

/** Removes one of the shop's own documents while the spec takes bids. */
export async function removeOfferDocument(user: User, specId: string | undefined, documentId: string | undefined): Promise<string> {
  const { bid } = await ownOpenBid(user, specId);
  const row = await BidDocument.findOne({ where: { id: requireId(documentId), bidId: bid.id } });
  if (!row) notFound("No such document.");
  await row.destroy();
  await discardStaged([row]);
  return row.fileName;
}

/** The shop's own documents on its bid, for its form. */
export async function ownOfferDocuments(spec: { id: string }, bid: Bid | null) {
  return bid ? ((await documentsOfBids(spec.id, [bid.id]))[bid.id] ?? []) : [];
}

/** A document's bytes for someone who may read the offer's documents; anyone else gets a 404. */
export async function openOfferDocument(user: User, specId: string | undefined, bidId: string | undefined, documentId: string | undefined) {
  const viewer = await viewerOf(user);
  const bid = await Bid.findOne({ where: { [Op.and]: [offerDocumentsWhere(viewer), { id: requireId(bidId), specId: requireId(specId) }] } });
  if (!bid) notFound("No such document.");
  const row = await BidDocument.findOne({ where: { id: requireId(documentId), bidId: bid.id } });
  if (!row) notFound("No such document.");
  const body = await readingStorage(() => fileStorage().get(row.storageKey));
  if (!body) notFound("This document is no longer stored.");
  return { body, fileName: row.fileName, contentType: row.contentType, sizeBytes: row.sizeBytes };
}
