import type { Route } from "./+types/job-order.pdf";
import { requireUser } from "~/auth/permissions.server";
import { notFound } from "~/services/errors.server";
import { downloadResponse } from "~/services/file-download.server";
import { safeFileStem } from "~/services/exports/file-name";
import { orderConfirmationFor } from "~/services/order-confirmation.server";
import { orderPdf } from "~/services/order-pdf.server";

// The order confirmation as a PDF, for whoever may read the job (the job's scope decides).
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const { order } = await orderConfirmationFor(user, params.jobId);
  if (!order) notFound("This job was awarded before order confirmations were made.");
  const bytes = await orderPdf(order);
  const fileName = `${order.number} - ${safeFileStem(order.spec.title)} - order confirmation.pdf`;
  return downloadResponse(bytes, { fileName, contentType: "application/pdf", sizeBytes: bytes.byteLength });
}
