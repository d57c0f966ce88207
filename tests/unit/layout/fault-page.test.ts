import { describe, expect, it } from "vitest";
import { faultText } from "@/components/layout/fault-page";
import { DB_UNAVAILABLE_DIGEST } from "@/lib/http/outage-codes";
import { isDatabaseUnavailable } from "@/db/outage";

describe("fault pages", () => {
  it("say the database is unavailable for an outage, with no reference to quote", () => {
    const t = faultText(DB_UNAVAILABLE_DIGEST);
    expect(t.title).toBe("The database is unavailable");
    expect(t.body).toMatch(/Nothing you saved earlier is lost/);
    expect(t.reference).toBeNull();
  });

  it("call anything else an error on our side and give its reference", () => {
    const t = faultText("123456789");
    expect(t.title).toBe("Something went wrong on our side");
    expect(t.reference).toBe("123456789");
  });
});

describe("isDatabaseUnavailable", () => {
  const coded = (code: string) => Object.assign(new Error(code), { code });
  it("recognises connection failures, pool time-outs and lost connections (also as a cause)", () => {
    for (const e of [coded("ECONNREFUSED"), coded("PROTOCOL_CONNECTION_LOST"), coded("ER_SERVER_SHUTDOWN"), Object.assign(new Error("x"), { name: "KnexTimeoutError" }), new Error("outer", { cause: coded("ETIMEDOUT") })]) {
      expect(isDatabaseUnavailable(e)).toBe(true);
    }
  });
  it("does not mistake query errors or plain errors for an outage", () => {
    for (const e of [coded("ER_DUP_ENTRY"), coded("ER_PARSE_ERROR"), new Error("Matrix is not symmetric"), null, "ECONNREFUSED"]) {
      expect(isDatabaseUnavailable(e)).toBe(false);
    }
  });
});
