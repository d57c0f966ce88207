import { beforeEach, describe, expect, it, vi } from "vitest";

/** The jwt callback behind next-auth's /api/auth/session: a token whose server-side session ended names nobody. */

/** What the stubbed session store answers (a plain function: the rejections stay with the caller that awaits them). */
let answer: () => Promise<string> = async () => "live";
const asked: string[] = [];
const peek = {
  mockResolvedValue: (state: string) => (answer = async () => state),
  mockImplementation: (f: () => Promise<string>) => (answer = f),
  mockReset: () => ((answer = async () => "live"), asked.splice(0)),
};
vi.mock("@/lib/auth/sessions", () => ({ peekSession: (sid: string) => (asked.push(sid), answer()), startSession: vi.fn(), endSession: vi.fn() }));

const { authOptions } = await import("@/lib/auth/options");
type JwtArgs = Parameters<NonNullable<NonNullable<typeof authOptions.callbacks>["jwt"]>>[0];
const jwt = (args: Partial<JwtArgs>) => authOptions.callbacks!.jwt!({ token: {}, account: null, ...args } as JwtArgs);
const token = { uid: 7, role: "developer", sid: "s".repeat(43) };

beforeEach(() => peek.mockReset());

describe("authOptions.callbacks.jwt", () => {
  it("keeps the token of a live session (asked without counting as activity)", async () => {
    peek.mockResolvedValue("live");
    await expect(jwt({ token })).resolves.toEqual(token);
    expect(asked).toEqual([token.sid]);
  });

  it.each(["revoked", "idle", "expired", "inactive_user", "unknown"])("refuses a token whose session is %s (next-auth then answers {} and clears the cookie)", async (state) => {
    peek.mockResolvedValue(state);
    await expect(jwt({ token })).rejects.toMatchObject({ name: "SessionEndedError", message: `session ${state}` });
  });

  it("refuses a token without a session id without asking the database", async () => {
    await expect(jwt({ token: { uid: 7, role: "developer" } })).rejects.toMatchObject({ name: "SessionEndedError" });
    expect(asked).toEqual([]);
  });

  it("keeps the token while the database is unreachable (an outage signs nobody out)", async () => {
    peek.mockImplementation(async () => {
      throw Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3307"), { code: "ECONNREFUSED" });
    });
    await expect(jwt({ token })).resolves.toEqual(token);
  });

  it("passes any other database error on", async () => {
    peek.mockImplementation(async () => {
      throw Object.assign(new Error("Unknown column 'x'"), { code: "ER_BAD_FIELD_ERROR" });
    });
    await expect(jwt({ token })).rejects.toThrow("Unknown column 'x'");
  });

  it("on sign-in copies the user's id, role and new session id into the token without a lookup", async () => {
    const out = await jwt({ token: {}, user: { id: "3", email: "a@b.test", role: "reviewer", sid: "new-sid" } as never });
    expect(out).toMatchObject({ uid: 3, role: "reviewer", sid: "new-sid" });
    expect(asked).toEqual([]);
  });

  it("stays quiet for an ended session in next-auth's log, and reports any other error", () => {
    const spy = vi.spyOn(console, "error").mockImplementation(() => {});
    const ended = Object.assign(new Error("session revoked"), { name: "SessionEndedError" });
    authOptions.logger!.error!("JWT_SESSION_ERROR", ended);
    expect(spy).not.toHaveBeenCalled();
    authOptions.logger!.error!("JWT_SESSION_ERROR", new Error("decryption failed"));
    expect(spy).toHaveBeenCalledTimes(1);
    spy.mockRestore();
  });
});
