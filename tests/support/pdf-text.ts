// The text of an uncompressed PDF as pdfkit writes it, for tests: each font's ToUnicode map read,
// then every TJ string of the content streams decoded through the font it is set in. Enough for
// pdfkit's own output (two-byte glyph codes, one content stream per page), not for any PDF.

function objects(pdf: string) {
  const found = new Map<string, string>();
  for (const match of pdf.matchAll(/(\d+) 0 obj\n([\s\S]*?)\nendobj/g)) found.set(match[1], match[2]);
  return found;
}

const hexText = (hex: string) => {
  let text = "";
  for (let i = 0; i + 4 <= hex.length; i += 4) text += String.fromCharCode(parseInt(hex.slice(i, i + 4), 16));
  return text;
};

/** Glyph code → text, from a ToUnicode CMap (bfrange with arrays or a start, and bfchar). */
function cmapOf(stream: string) {
  const map = new Map<number, string>();
  for (const block of stream.matchAll(/beginbfrange\n([\s\S]*?)endbfrange/g)) {
    for (const line of block[1].split("\n")) {
      const array = /^<([0-9a-f]+)> <([0-9a-f]+)> \[(.*)\]$/i.exec(line.trim());
      if (array) {
        const start = parseInt(array[1], 16);
        [...array[3].matchAll(/<([0-9a-f ]+)>/gi)].forEach((m, i) => map.set(start + i, hexText(m[1].replace(/ /g, ""))));
        continue;
      }
      const range = /^<([0-9a-f]+)> <([0-9a-f]+)> <([0-9a-f]+)>$/i.exec(line.trim());
      if (range) for (let c = parseInt(range[1], 16), u = parseInt(range[3], 16); c <= parseInt(range[2], 16); c++, u++) map.set(c, String.fromCharCode(u));
    }
  }
  for (const block of stream.matchAll(/beginbfchar\n([\s\S]*?)endbfchar/g)) {
    for (const m of block[1].matchAll(/<([0-9a-f]+)> <([0-9a-f]+)>/gi)) map.set(parseInt(m[1], 16), hexText(m[2]));
  }
  return map;
}

/** The PDF's text, one line per text object (BT … ET). */
export function pdfText(bytes: Uint8Array): string {
  const pdf = Buffer.from(bytes).toString("latin1");
  const objs = objects(pdf);
  const fontMaps = new Map<string, Map<number, string>>();
  for (const [id, body] of objs) {
    const toUnicode = /\/ToUnicode (\d+) 0 R/.exec(body);
    if (/\/Type \/Font/.test(body) && toUnicode) fontMaps.set(id, cmapOf(objs.get(toUnicode[1]) ?? ""));
  }
  const resourceFonts = new Map<string, string>();
  for (const m of pdf.matchAll(/\/(F\d+) (\d+) 0 R/g)) resourceFonts.set(m[1], m[2]);
  const lines: string[] = [];
  for (const block of pdf.matchAll(/\nBT\n([\s\S]*?)\nET/g)) {
    let map = new Map<number, string>();
    let line = "";
    for (const op of block[1].split("\n")) {
      const tf = /^\/(F\d+) [\d.]+ Tf$/.exec(op);
      if (tf) map = fontMaps.get(resourceFonts.get(tf[1]) ?? "") ?? new Map();
      if (!op.endsWith("TJ")) continue;
      for (const s of op.matchAll(/<([0-9a-f]*)>/gi)) {
        for (let i = 0; i + 4 <= s[1].length; i += 4) line += map.get(parseInt(s[1].slice(i, i + 4), 16)) ?? "\ufffd";
      }
    }
    lines.push(line);
  }
  return lines.join("\n");
}
