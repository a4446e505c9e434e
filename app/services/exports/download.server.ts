import type ExcelJS from "exceljs";
import { contentDisposition } from "../attachments.server";
import { XLSX_TYPE, xlsxBytes } from "./sheet-layout.server";

/**
 * A workbook as a download: always saved rather than shown, never cached by a shared proxy
 * (prices and bids are private), with the exact name in UTF-8 and an ASCII fallback.
 */
export async function workbookDownload(workbook: ExcelJS.Workbook, fileName: string): Promise<Response> {
  const bytes = await xlsxBytes(workbook);
  return new Response(bytes, {
    headers: {
      "Content-Type": XLSX_TYPE,
      "Content-Length": String(bytes.byteLength),
      "Content-Disposition": contentDisposition(fileName),
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
}
