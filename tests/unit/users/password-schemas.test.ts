import { describe, expect, it } from "vitest";
import { redactPasswordLinks } from "@/lib/users/link-redaction";
import { changePasswordSchema, createUserSchema, setPasswordSchema } from "@/lib/users/schemas";

const TOKEN = "A".repeat(43);

describe("password rules", () => {
  it("accepts 12 to 72 bytes and names the field and the limit otherwise", () => {
    expect(setPasswordSchema.safeParse({ token: TOKEN, password: "a".repeat(12), confirm: "a".repeat(12) }).success).toBe(true);
    const short = setPasswordSchema.safeParse({ token: TOKEN, password: "a".repeat(11), confirm: "a".repeat(11) });
    expect(short.error?.issues[0]).toMatchObject({ path: ["password"], message: "New password: at least 12 characters." });
    // bcrypt reads only 72 bytes: a longer password would be silently cut, so it is refused
    const long = setPasswordSchema.safeParse({ token: TOKEN, password: "é".repeat(37), confirm: "é".repeat(37) });
    expect(long.error?.issues[0].message).toMatch(/at most 72 bytes/);
    expect(setPasswordSchema.safeParse({ token: TOKEN, password: "é".repeat(36), confirm: "é".repeat(36) }).success).toBe(true);
  });

  it("requires the repeat to match, and a change to differ from the current password", () => {
    expect(setPasswordSchema.safeParse({ token: TOKEN, password: "a-long-password-1", confirm: "a-long-password-2" }).error?.issues[0].path).toEqual(["confirm"]);
    const same = changePasswordSchema.safeParse({ current: "a-long-password-1", password: "a-long-password-1", confirm: "a-long-password-1" });
    expect(same.error?.issues[0]).toMatchObject({ path: ["password"] });
  });

  it("the admin's new-account form has no password field at all", () => {
    expect(Object.keys(createUserSchema.shape)).toEqual(["email", "name", "role"]);
  });

  it("withholds set-password tokens from mail shown on screen", () => {
    const text = `Choose it here:\nhttp://127.0.0.1:3000/login/password/${TOKEN}\nThanks`;
    expect(redactPasswordLinks(text)).not.toContain(TOKEN);
    expect(redactPasswordLinks(text)).toContain("/login/password/[withheld");
  });
});
