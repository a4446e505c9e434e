import type ExcelJS from "exceljs";
import { downloadResponse } from "../file-download.server";
import { XLSX_TYPE, xlsxBytes } from "./sheet-layout.server";

/**
 * A workbook as a download (`downloadResponse`): always saved rather than shown, never cached
 * (prices and bids are private), with the exact name in UTF-8 and an ASCII fallback.
 */
export async function workbookDownload(workbook: ExcelJS.Workbook, fileName: string): Promise<Response> {
  const bytes = await xlsxBytes(workbook);
  return downloadResponse(bytes, { fileName, contentType: XLSX_TYPE, sizeBytes: bytes.byteLength });
}
