import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { sniffFileType } from "@/lib/uploads/file-type";
import { neutraliseCell } from "@/lib/csv-cell";
import { parseMentions } from "@/lib/maintenance/mentions";

describe("sniffFileType", () => {
  // Signatures: PNG spec (W3C, 3rd ed.) §5.2 "89 50 4E 47 0D 0A 1A 0A"; JPEG SOI FF D8 then a marker
  // FF (ITU-T T.81 B.1.1.3); WebP container "RIFF" size "WEBP" (RFC 9649 §2.5); PDF "%PDF-" (ISO 32000-1 §7.5.2).
  it("recognises the four accepted kinds by content", () => {
    expect(sniffFileType(fs.readFileSync("tests/fixtures/checklist-photo.png"))?.contentType).toBe("image/png");
    expect(sniffFileType(Uint8Array.from([0xff, 0xd8, 0xff, 0xe0, 0, 16]))?.contentType).toBe("image/jpeg");
    expect(sniffFileType(new TextEncoder().encode("RIFF\u0010\u0000\u0000\u0000WEBPVP8 "))?.contentType).toBe("image/webp");
    expect(sniffFileType(new TextEncoder().encode("%PDF-1.7\n"))?.contentType).toBe("application/pdf");
  });
  it("refuses anything else, whatever it is called", () => {
    expect(sniffFileType(new TextEncoder().encode("<svg xmlns='http://www.w3.org/2000/svg'/>"))).toBeNull();
    expect(sniffFileType(new TextEncoder().encode("RIFF\u0010\u0000\u0000\u0000WAVEfmt "))).toBeNull();
    expect(sniffFileType(Uint8Array.from([0x89, 0x50, 0x4e, 0x47]))).toBeNull();
  });
});

describe("neutraliseCell (OWASP, CSV Injection: prefix cells starting with = + - @ tab CR)", () => {
  it("prefixes formula-looking text with an apostrophe", () => {
    expect(neutraliseCell("=HYPERLINK(\"http://x\")")).toBe("'=HYPERLINK(\"http://x\")");
    expect(neutraliseCell("+1+2")).toBe("'+1+2");
    expect(neutraliseCell("-2+3")).toBe("'-2+3");
    expect(neutraliseCell("@SUM(A1)")).toBe("'@SUM(A1)");
    expect(neutraliseCell("\t=1")).toBe("'\t=1");
  });
  it("leaves plain text, numbers and empties alone", () => {
    expect(neutraliseCell("Clean exhaust")).toBe("Clean exhaust");
    expect(neutraliseCell(-3)).toBe("-3");
    expect(neutraliseCell(null)).toBe("");
  });
});

describe("parseMentions", () => {
  const people = [
    { id: "u1", email: "tech@brightwater.example", name: "Tomás Kelly" },
    { id: "u2", email: "engineer@brightwater.example", name: "Priya Nair" },
  ];
  it("finds people by first name (accents optional), e-mail or its local part, once each", () => {
    expect(parseMentions("@tomas please check, cc @Priya and @tech", people)).toEqual(["u1", "u2"]);
    expect(parseMentions("ask engineer@brightwater.example", people)).toEqual([]);
    expect(parseMentions("(@engineer@brightwater.example)", people)).toEqual(["u2"]);
  });
  it("ignores unknown names", () => {
    expect(parseMentions("@nobody", people)).toEqual([]);
  });
});
