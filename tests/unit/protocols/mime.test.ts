import { describe, expect, it } from "vitest";
import { toCsv } from "@/lib/format/csv";
import { plainTextOf, subjectOf } from "@/lib/format/mime";

describe("captured mail reading", () => {
  it("decodes an RFC 2047 subject split over adjacent encoded words without adding spaces", () => {
    const raw = "From: a@b.test\r\nSubject: =?UTF-8?Q?Signed_off:_JRN-0001_version_2_=E2=80=94_Journey_two_17?=\r\n =?UTF-8?Q?96164335624?=\r\n\r\nbody";
    expect(subjectOf(raw)).toBe("Signed off: JRN-0001 version 2 — Journey two 1796164335624");
    expect(subjectOf("Subject: plain words\r\n\r\n")).toBe("plain words");
  });

  it("extracts and decodes the quoted-printable text part", () => {
    const raw = [
      "Content-Type: multipart/alternative; boundary=\"--b\"", "", "----b",
      "Content-Type: text/plain; charset=utf-8", "Content-Transfer-Encoding: quoted-printable", "",
      "Quinn signed off =E2=80=94 meaning: Approved for bench use. A long line that is=", " wrapped.", "----b",
      "Content-Type: text/html", "", "<p>html</p>", "----b--",
    ].join("\r\n");
    expect(plainTextOf(raw)).toBe("Quinn signed off — meaning: Approved for bench use. A long line that is wrapped.");
  });
});

describe("CSV export", () => {
  it("quotes per RFC 4180 and defuses spreadsheet formulas", () => {
    expect(toCsv([["a", "b"], ["1,5", 'say "hi"']])).toBe('a,b\r\n"1,5","say ""hi"""\r\n');
    expect(toCsv([["=SUM(A1)", -2, null, "line\nbreak"]])).toBe(`'=SUM(A1),-2,,"line\nbreak"\r\n`);
    expect(toCsv([[0.1 + 0.2, 12589.254117941673, 4.166666666666667e-6]])).toBe("0.3,12589.25412,0.000004166666667\r\n");
  });
});
