import { describe, expect, it } from "vitest";
import { CrossSiteError, UnsupportedMediaTypeError } from "@/lib/errors";
import { appOrigins, assertContentType, assertSameOrigin } from "@/lib/http/origin";

const ENV = { APP_BASE_URL: "http://127.0.0.1:3000", NEXTAUTH_URL: "http://127.0.0.1:3000" };
const URL_ = "http://127.0.0.1:3000/api/v1/runs";
const req = (method: string, headers: Record<string, string>) => new Request(URL_, { method, headers });

function refusal(fn: () => void): unknown {
  try {
    fn();
    return null;
  } catch (err) {
    return err;
  }
}

describe("same-origin check for cookie-session calls", () => {
  it("accepts the app's own origin and Sec-Fetch-Site: same-origin", () => {
    expect(refusal(() => assertSameOrigin(req("POST", { origin: "http://127.0.0.1:3000" }), ENV))).toBeNull();
    expect(refusal(() => assertSameOrigin(req("POST", { "sec-fetch-site": "same-origin" }), ENV))).toBeNull();
  });

  it.each([
    ["another port of the same host", { origin: "http://127.0.0.1:4000" }],
    ["another scheme", { origin: "https://127.0.0.1:3000" }],
    ["another host", { origin: "http://evil.example" }],
    ["a look-alike host", { origin: "http://127.0.0.1:3000.evil.example" }],
    ["an opaque origin (sandboxed frame, file:)", { origin: "null" }],
    ["no Origin and no Sec-Fetch-Site", {}],
    ["no Origin, cross-site fetch metadata", { "sec-fetch-site": "cross-site" }],
    ["no Origin, same-site (other port) fetch metadata", { "sec-fetch-site": "same-site" }],
    ["a foreign Origin even with same-origin fetch metadata", { origin: "http://evil.example", "sec-fetch-site": "same-origin" }],
  ])("refuses %s with 403 cross_site", (_name, headers) => {
    const err = refusal(() => assertSameOrigin(req("POST", headers), ENV));
    expect(err).toBeInstanceOf(CrossSiteError);
    expect((err as CrossSiteError).status).toBe(403);
    expect((err as CrossSiteError).message).toContain("http://127.0.0.1:3000");
  });

  it("checks PUT, PATCH and DELETE too, and lets safe methods through", () => {
    for (const m of ["PUT", "PATCH", "DELETE"]) expect(refusal(() => assertSameOrigin(req(m, { origin: "http://evil.example" }), ENV))).toBeInstanceOf(CrossSiteError);
    for (const m of ["GET", "HEAD", "OPTIONS"]) expect(refusal(() => assertSameOrigin(req(m, { origin: "http://evil.example" }), ENV))).toBeNull();
  });

  it("takes the origins from APP_BASE_URL and NEXTAUTH_URL, or the request when neither is set", () => {
    expect(appOrigins(URL_, { APP_BASE_URL: "https://sw.lab.example/", NEXTAUTH_URL: "https://sw.lab.example" })).toEqual(["https://sw.lab.example"]);
    expect(appOrigins("http://10.0.0.5:3000/api/v1/runs", {})).toEqual(["http://10.0.0.5:3000"]);
  });
});

describe("content-type check for cookie-session calls", () => {
  it("accepts the expected media type with parameters, in any case", () => {
    expect(refusal(() => assertContentType(req("POST", { "content-type": "application/json; charset=utf-8" }), ["application/json"]))).toBeNull();
    expect(refusal(() => assertContentType(req("POST", { "content-type": "Multipart/Form-Data; boundary=x" }), ["multipart/form-data"]))).toBeNull();
  });

  it.each(["text/plain", "application/x-www-form-urlencoded", "multipart/form-data", ""])("refuses %j where JSON is expected, with 415", (type) => {
    const err = refusal(() => assertContentType(req("POST", type ? { "content-type": type } : {}), ["application/json"]));
    expect(err).toBeInstanceOf(UnsupportedMediaTypeError);
    expect((err as UnsupportedMediaTypeError).status).toBe(415);
    expect((err as UnsupportedMediaTypeError).message).toContain("application/json");
  });
});
