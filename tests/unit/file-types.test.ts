import { describe, expect, it } from "vitest";
import { ACCEPT_ATTRIBUTE, checkFileType, extensionOf, sniffFileKind } from "~/services/file-types";

// Minimal but real openings of each format, built byte by byte.
const bytes = (...parts: (string | number[])[]) => new Uint8Array(parts.flatMap((p) => (typeof p === "string" ? Array.from(new TextEncoder().encode(p)) : p)));

const PNG = bytes(
  [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], // signature
  [0x00, 0x00, 0x00, 0x0d],
  "IHDR",
  [0, 0, 0, 1, 0, 0, 0, 1, 8, 6, 0, 0, 0],
  [0x1f, 0x15, 0xc4, 0x89], // 1×1 RGBA header chunk
);
const JPEG = bytes([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10], "JFIF", [0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00]);
const PDF = bytes("%PDF-1.7\n%\u00e2\u00e3\u00cf\u00d3\n1 0 obj\n<< /Type /Catalog >>\nendobj\n");
const ASCII_DXF = bytes("  0\r\nSECTION\r\n  2\r\nHEADER\r\n  9\r\n$ACADVER\r\n  1\r\nAC1015\r\n");
const ASCII_DXF_WITH_COMMENT = bytes("999\nexported by a CAD program\n0\nSECTION\n2\nENTITIES\n");
const BINARY_DXF = bytes("AutoCAD Binary DXF\r\n", [0x1a, 0x00], [0x00, 0x00], "SECTION", [0x00]);
const STEP = bytes("ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION(('cylinder mount'),'2;1');\n");
const EXE = bytes("MZ", [0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00], "This program cannot be run in DOS mode.");
const TEXT = bytes("Bore 63 mm, rod 36 mm, stroke 400 mm\n");

describe("sniffing by content", () => {
  it.each([
    ["png", PNG],
    ["jpeg", JPEG],
    ["pdf", PDF],
    ["dxf", ASCII_DXF],
    ["dxf", ASCII_DXF_WITH_COMMENT],
    ["dxf", BINARY_DXF],
    ["step", STEP],
  ] as const)("recognises %s", (kind, head) => {
    expect(sniffFileKind(head)).toBe(kind);
  });

  it("recognises none of the accepted kinds in a program, plain text or nothing", () => {
    expect(sniffFileKind(EXE)).toBeNull();
    expect(sniffFileKind(TEXT)).toBeNull();
    expect(sniffFileKind(new Uint8Array())).toBeNull();
    // The DXF section marker is only a DXF when it opens the file.
    expect(sniffFileKind(bytes("hello\n0\nSECTION\n"))).toBeNull();
    // A NUL byte before a STEP header marks binary, not STEP.
    expect(sniffFileKind(bytes([0x00], "ISO-10303-21;"))).toBeNull();
  });
});

describe("checking a file by name and content together", () => {
  it("accepts a file whose extension matches its content, in any case of the extension", () => {
    expect(checkFileType("Layout.PDF", PDF)).toEqual({ ok: true, kind: "pdf" });
    expect(checkFileType("photo.jpeg", JPEG)).toEqual({ ok: true, kind: "jpeg" });
    expect(checkFileType("photo.JPG", JPEG)).toEqual({ ok: true, kind: "jpeg" });
    expect(checkFileType("bracket.stp", STEP)).toEqual({ ok: true, kind: "step" });
    expect(checkFileType("bracket.step", STEP)).toEqual({ ok: true, kind: "step" });
    expect(checkFileType("plate.dxf", BINARY_DXF)).toEqual({ ok: true, kind: "dxf" });
  });

  it("refuses a program renamed to .pdf", () => {
    const check = checkFileType("drawing.pdf", EXE);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.reason).toMatch(/ends in \.pdf but the content is not a PDF/);
  });

  it("refuses a PNG named .pdf and says what it really is", () => {
    const check = checkFileType("drawing.pdf", PNG);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.reason).toMatch(/is a PNG image\. Rename it to \.png/);
  });

  it("refuses text named .png", () => {
    const check = checkFileType("notes.png", TEXT);
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.reason).toMatch(/not a PNG image/);
  });

  it("refuses an accepted format under an extension we don't take", () => {
    const exe = checkFileType("setup.exe", PDF);
    expect(exe.ok).toBe(false);
    if (!exe.ok) expect(exe.reason).toMatch(/"\.exe" files can't be attached/);
    const bare = checkFileType("README", PDF);
    expect(bare.ok).toBe(false);
    if (!bare.ok) expect(bare.reason).toMatch(/without an extension/);
  });
});

describe("names", () => {
  it("reads the extension after the last dot; a leading dot is no extension", () => {
    expect(extensionOf("a.tar.PDF")).toBe(".pdf");
    expect(extensionOf(".pdf")).toBe("");
    expect(extensionOf("plan")).toBe("");
  });

  it("offers every accepted extension to the file picker", () => {
    expect(ACCEPT_ATTRIBUTE.split(",")).toEqual([".pdf", ".png", ".jpg", ".jpeg", ".dxf", ".step", ".stp"]);
  });
});
