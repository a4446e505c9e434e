import { createRequire } from "node:module";
import path from "node:path";
import PDFDocument from "pdfkit";
import { formatDay } from "~/content/dates";
import { formatMoney } from "~/content/money";
import type { OrderDocument, OrderParty } from "~/content/order-document";
import { profileLine } from "~/components/organisation-profile";

// The order confirmation as a PDF, drawn with pdfkit on A4. The text is set in the app's own
// Open Sans, embedded from the @fontsource files the pages use: pdfkit (through fontkit) reads
// their WOFF files (not the WOFF2 ones, whose subsetting fails), one file per Unicode subset, so
// each piece of text is set in the Latin file and any letter outside it (ő, Ł, ...) in the
// Latin Extended one. Letters of neither (Greek, CJK) show as a missing glyph.

const require = createRequire(import.meta.url);
const FONT_DIR = path.join(path.dirname(require.resolve("@fontsource/open-sans/package.json")), "files");
const FONTS = {
  regular: "open-sans-latin-400-normal.woff",
  "regular-ext": "open-sans-latin-ext-400-normal.woff",
  bold: "open-sans-latin-600-normal.woff",
  "bold-ext": "open-sans-latin-ext-600-normal.woff",
} as const;
type Weight = "regular" | "bold";

/** Google Fonts' Latin subset (the @fontsource latin file's unicode-range). */
const inLatinSubset = (code: number) =>
  code <= 0xff ||
  [0x131, 0x152, 0x153, 0x2bb, 0x2bc, 0x2c6, 0x2da, 0x2dc, 0x304, 0x308, 0x329, 0x20ac, 0x2122, 0x2191, 0x2193, 0x2212, 0x2215, 0xfeff, 0xfffd].includes(
    code,
  ) ||
  (code >= 0x2000 && code <= 0x206f);

/** The text cut into runs, each set in the subset file that has its letters. */
function runsOf(text: string, weight: Weight): { font: keyof typeof FONTS; text: string }[] {
  const runs: { font: keyof typeof FONTS; text: string }[] = [];
  for (const char of text) {
    const font = inLatinSubset(char.codePointAt(0)!) ? weight : (`${weight}-ext` as const);
    const last = runs.at(-1);
    if (last?.font === font) last.text += char;
    else runs.push({ font, text: char });
  }
  return runs;
}

const A4 = { width: 595.28, height: 841.89 };
const MARGIN = 50;
const CONTENT_WIDTH = A4.width - 2 * MARGIN;
const INK = "#131b25";
const MUTED = "#3f4d5e";

type Doc = PDFKit.PDFDocument;

/** Writes text at (x, y) within `width`, switching subset files where the letters need it; returns the height used. */
function write(
  doc: Doc,
  text: string,
  x: number,
  y: number,
  options: { width: number; size?: number; weight?: Weight; color?: string; align?: "left" | "right" },
) {
  const size = options.size ?? 9.5;
  const runs = runsOf(text || " ", options.weight ?? "regular");
  doc.fillColor(options.color ?? INK).fontSize(size);
  const height = heightOf(doc, text, options.width, size, options.weight);
  runs.forEach((run, i) => {
    doc.font(run.font);
    const continued = i < runs.length - 1;
    if (i === 0) doc.text(run.text, x, y, { width: options.width, align: options.align ?? "left", continued });
    else doc.text(run.text, { continued });
  });
  return height;
}

function heightOf(doc: Doc, text: string, width: number, size: number, weight: Weight = "regular") {
  doc.font(weight).fontSize(size);
  return doc.heightOfString(text || " ", { width });
}

const COLUMNS = [
  { title: "Item", width: 140, align: "left" as const },
  { title: "Specification", width: 165, align: "left" as const },
  { title: "Qty", width: 35, align: "right" as const },
  { title: "Unit price", width: 77, align: "right" as const },
  { title: "Line total", width: 78, align: "right" as const },
];

/** Draws one table row (each cell wrapped in its column), starting a new page first when it would not fit. */
function row(doc: Doc, y: number, cells: string[], weight: Weight = "regular") {
  const gap = 4;
  const height = Math.max(...cells.map((c, i) => heightOf(doc, c, COLUMNS[i].width - gap, 9, weight))) + 6;
  if (y + height > A4.height - MARGIN - 20) {
    doc.addPage();
    y = MARGIN;
  }
  let x = MARGIN;
  cells.forEach((cell, i) => {
    write(doc, cell, x, y + 3, { width: COLUMNS[i].width - gap, size: 9, weight, align: COLUMNS[i].align });
    x += COLUMNS[i].width;
  });
  doc
    .moveTo(MARGIN, y + height)
    .lineTo(MARGIN + CONTENT_WIDTH, y + height)
    .lineWidth(0.5)
    .strokeColor("#c9d1db")
    .stroke();
  return y + height;
}

/** Label and value pairs, two columns wide. */
function facts(doc: Doc, y: number, pairs: [string, string][]) {
  for (const [label, value] of pairs) {
    const height = Math.max(heightOf(doc, value, CONTENT_WIDTH - 160, 9.5), 12);
    if (y + height > A4.height - MARGIN - 20) {
      doc.addPage();
      y = MARGIN;
    }
    write(doc, label, MARGIN, y, { width: 150, color: MUTED });
    write(doc, value, MARGIN + 160, y, { width: CONTENT_WIDTH - 160 });
    y += height + 4;
  }
  return y;
}

function heading(doc: Doc, y: number, text: string) {
  if (y + 40 > A4.height - MARGIN) {
    doc.addPage();
    y = MARGIN;
  }
  write(doc, text, MARGIN, y, { width: CONTENT_WIDTH, size: 11, weight: "bold" });
  return y + 18;
}

/** The order confirmation as PDF bytes. `compress: false` keeps the text readable to a test. */
export async function orderPdf(order: OrderDocument, options: { compress?: boolean } = {}): Promise<Uint8Array<ArrayBuffer>> {
  const doc = new PDFDocument({
    size: "A4",
    margin: MARGIN,
    compress: options.compress ?? true,
    bufferPages: true,
    info: { Title: `Order confirmation ${order.number}`, Author: "Tenderflow", Subject: order.spec.title },
  });
  for (const [name, file] of Object.entries(FONTS)) doc.registerFont(name, path.join(FONT_DIR, file));
  const chunks: Buffer[] = [];
  doc.on("data", (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<void>((resolve, reject) => {
    doc.on("end", resolve);
    doc.on("error", reject);
  });
  const money = (cents: number) => formatMoney(cents, order.currency);

  let y = MARGIN;
  write(doc, "Order confirmation", MARGIN, y, { width: 300, size: 20, weight: "bold" });
  write(doc, order.number, MARGIN + 300, y + 4, { width: CONTENT_WIDTH - 300, size: 13, weight: "bold", align: "right" });
  y += 30;
  write(doc, `Issued ${formatDay(order.issuedAt)} through Tenderflow`, MARGIN, y, { width: CONTENT_WIDTH, color: MUTED });
  y += 26;

  const half = CONTENT_WIDTH / 2 - 10;
  const party = (x: number, title: string, p: OrderParty) => {
    write(doc, title, x, y, { width: half, size: 8.5, color: MUTED });
    let used = 12 + write(doc, p.name, x, y + 12, { width: half, size: 11, weight: "bold" });
    const contact = p.quoteContact ? [p.quoteContact.name, p.quoteContact.phone, p.quoteContact.email].filter(Boolean).join(", ") : "";
    for (const line of [profileLine(p), p.address, p.taxNumber && `Tax number: ${p.taxNumber}`, contact && `Quotes: ${contact}`]) {
      if (line) used += write(doc, line, x, y + used + 2, { width: half }) + 2;
    }
    return used;
  };
  y += Math.max(party(MARGIN, "Buyer", order.buyer), party(MARGIN + half + 20, "Supplier (shop)", order.shop)) + 14;

  y = facts(doc, y, [
    ["Spec", `${order.spec.title || "Untitled spec"}, revision ${order.spec.revision}`],
    ["Awarded by", `${order.awardedBy}, ${formatDay(order.issuedAt)}`],
  ]);
  y += 8;

  y = heading(doc, y, "Lines offered");
  y = row(
    doc,
    y,
    COLUMNS.map((c) => c.title),
    "bold",
  );
  for (const line of order.lines) {
    y = row(doc, y, [
      line.item,
      line.alternative ? `${line.specification}\nAlternative: ${line.note}` : line.specification,
      String(line.quantity),
      money(line.unitPriceCents),
      money(line.totalCents),
    ]);
  }
  y += 10;

  if (order.extras.length || order.ownLines.length) {
    y = heading(doc, y, "Work beyond the bill");
    y = facts(doc, y, [
      ...order.extras.map((e): [string, string] => [e.name, e.priceCents === null ? "Included" : money(e.priceCents)]),
      ...order.ownLines.map((l): [string, string] => [l.name, money(l.priceCents)]),
    ]);
  }
  if (order.leavesOut.length) y = facts(doc, y, [["Not in this order", order.leavesOut.join("; ")]]);
  y += 8;

  y = heading(doc, y, "Price");
  y = facts(doc, y, [
    ...(order.units > 1
      ? ([
          ["Bill, one set", money(order.setTotalCents)],
          ["Units", String(order.units)],
        ] as [string, string][])
      : []),
    ["Total", money(order.totalCents)],
    [`Retainer (${Number(order.retainerPercent)} %)`, `${money(order.retainerCents)}, paid by card after the award`],
    ["Balance", `${money(order.balanceCents)}, after the handover`],
  ]);
  y += 8;

  y = heading(doc, y, "Dates and terms");
  y = facts(doc, y, [
    ["Lead time", order.leadTimeWeeks ? `${order.leadTimeWeeks} weeks` : "Not stated"],
    ["Handover planned by", order.handoverBy ? formatDay(order.handoverBy) : "Not planned yet"],
    ["Offer valid until", order.offerValidUntil ? formatDay(order.offerValidUntil) : "Not stated"],
    ["Terms", order.terms.join("\n") || "None stated"],
    ...(order.notes ? ([["Shop's notes", order.notes]] as [string, string][]) : []),
  ]);

  // Every page names the order, so a loose page is never anonymous.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    // The footer sits in the bottom margin, where pdfkit would otherwise start a new page.
    doc.page.margins.bottom = 0;
    write(doc, `Tenderflow order ${order.number} · page ${i + 1} of ${range.count}`, MARGIN, A4.height - MARGIN + 10, {
      width: CONTENT_WIDTH,
      size: 8,
      color: MUTED,
      align: "right",
    });
  }
  doc.end();
  await done;
  return new Uint8Array(Buffer.concat(chunks));
}
