import { spawn, type ChildProcess } from "node:child_process";
import { db } from "@/db/knex";
import { subjectOf } from "@/lib/format/mime";
import { readCapturedMail } from "@/lib/mail/sink";
import { submitVersion } from "@/lib/protocols/service";
import { createToken, revokeToken } from "@/lib/tokens/service";
import { findUserById } from "@/lib/users/repo";
import { approvedProtocolWithDraft, closeJourneyDb } from "@/tests/support/protocol-journey";
import { DEMO, DEMO_PASSWORD } from "./support/auth";
import { expect, test, type Page } from "./support/test";

/**
 * Two app instances on one database (what `npm start` runs with APP_WORKERS ≥ 2, or two hosts behind a balancer):
 * a session, the API rate limit, the sign-in attempt limits, the mail outbox and a concurrent sign-off behave as with
 * one instance, because all of that state lives in MariaDB. Both instances are `next start` processes of this build
 * on free ports, with a low rate limit and a short attempt limit so the limits are reached in a few requests; a
 * second outbox sender runs beside the tier's own.
 */

const RATE_LIMIT = 8;
const LOCK_AFTER = 3;
const children: ChildProcess[] = [];
let A = "";
let B = "";

/** Starts `next start` on a free port with extra environment; resolves with its base URL once it answers. */
async function startInstance(env: Record<string, string>): Promise<string> {
  const child = spawn(process.execPath, ["node_modules/next/dist/bin/next", "start", "-p", "0", "-H", "127.0.0.1"], { env: { ...process.env, ...env }, stdio: ["ignore", "pipe", "pipe"] });
  children.push(child);
  const url = await new Promise<string>((resolve, reject) => {
    let out = "";
    const timer = setTimeout(() => reject(new Error(`instance did not start in 60 s:\n${out}`)), 60_000);
    const look = (chunk: Buffer) => {
      out += chunk.toString();
      const m = /Local:\s+(http:\/\/127\.0\.0\.1:\d+)/.exec(out.replace(/\x1b\[[0-9;]*m/g, ""));
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout!.on("data", look);
    child.stderr!.on("data", look);
    child.once("exit", (code) => reject(new Error(`instance exited (${code}):\n${out}`)));
  });
  await expect.poll(async () => (await fetch(`${url}/api/auth/csrf`).catch(() => null))?.status ?? 0, { timeout: 60_000 }).toBe(200);
  return url;
}

const cookiesOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(";")[0]);

/** Signs in through next-auth's credentials endpoint of one instance; the session cookie, or the error it names
 * ("CredentialsSignin" for a wrong password, else the app's own sentence). */
async function signInVia(base: string, email: string, password: string): Promise<{ cookie: string | null; error: string | null }> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const csrfCookie = cookiesOf(csrf).join("; ");
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = cookiesOf(res).find((c) => c.includes("session-token")) ?? null;
  const url = ((await res.json().catch(() => ({}))) as { url?: string }).url ?? "";
  return { cookie: session && `${csrfCookie}; ${session}`, error: new URL(url, base).searchParams.get("error") };
}

async function signOutVia(base: string, cookie: string): Promise<void> {
  const { csrfToken } = (await (await fetch(`${base}/api/auth/csrf`, { headers: { cookie } })).json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/signout`, { method: "POST", redirect: "manual", headers: { "content-type": "application/x-www-form-urlencoded", cookie }, body: new URLSearchParams({ csrfToken, json: "true" }) });
  expect(res.status).toBeLessThan(400);
}

/** The signed-in user's name on a page of `base`, or null when the page sends the visitor to sign in. */
async function whoIsSignedIn(base: string, cookie: string): Promise<string | null> {
  const res = await fetch(`${base}/protocols`, { headers: { cookie }, redirect: "manual" });
  if (res.status === 307 || res.status === 302) {
    expect(res.headers.get("location")).toContain("/login");
    return null;
  }
  expect(res.status).toBe(200);
  const html = await res.text();
  if (/NEXT_REDIRECT;[a-z]+;\/login/.test(html)) return null;
  return /data-testid="current-user"[^>]*>([^<]+)</.exec(html)?.[1] ?? null;
}

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  test.setTimeout(180_000);
  const env = { RATE_LIMIT_PER_MINUTE: String(RATE_LIMIT), AUTH_ACCOUNT_DELAY_AFTER: String(LOCK_AFTER), AUTH_ACCOUNT_LOCK_AFTER: String(LOCK_AFTER) };
  [A, B] = await Promise.all([startInstance(env), startInstance(env)]);
  const sender = spawn(process.execPath, ["--import", "tsx", "scripts/outbox-worker.ts"], { env: process.env, stdio: "ignore" });
  children.push(sender);
});

test.afterAll(async () => {
  for (const child of children) if (child.exitCode === null) child.kill("SIGTERM");
  await closeJourneyDb();
});

test("a session opened on instance A works on B, and signing out on A ends it on B", async () => {
  const { cookie } = await signInVia(A, DEMO.supervisor, DEMO_PASSWORD);
  expect(cookie).not.toBeNull();
  expect(await whoIsSignedIn(A, cookie!)).toBe("Sam Superville");
  expect(await whoIsSignedIn(B, cookie!)).toBe("Sam Superville");
  await signOutVia(A, cookie!);
  expect(await whoIsSignedIn(B, cookie!)).toBeNull();
  expect(await whoIsSignedIn(A, cookie!)).toBeNull();
});

test(`the API rate limit (${RATE_LIMIT} a minute per token) counts requests to both instances together`, async () => {
  const row = await db("users").where({ email: DEMO.developer }).first("id");
  const user = (await findUserById(Number(row.id)))!;
  const token = await createToken(user, { label: "two instances" });
  try {
    const msLeft = 60_000 - (Date.now() % 60_000);
    if (msLeft < 15_000) await new Promise((r) => setTimeout(r, msLeft + 200));
    const call = (base: string) => fetch(`${base}/api/v1/spectra`, { method: "POST", headers: { authorization: `Bearer ${token.secret}`, "content-type": "application/json" }, body: "{}" });
    const statuses: number[] = [];
    for (let i = 0; i < RATE_LIMIT; i++) statuses.push((await call(i % 2 === 0 ? A : B)).status);
    expect(statuses.filter((s) => s === 429)).toEqual([]);
    const overA = await call(A);
    const overB = await call(B);
    expect([overA.status, overB.status]).toEqual([429, 429]);
    expect(overB.headers.get("retry-after")).toMatch(/^\d+$/);
    expect(((await overB.json()) as { message: string }).message).toContain(`at most ${RATE_LIMIT} API requests per minute`);
  } finally {
    await revokeToken(user, token.id);
  }
});

test(`the sign-in attempt limit (${LOCK_AFTER} failures per account) counts failures on both instances together`, async () => {
  const email = DEMO.technician;
  await db("auth_attempts").where({ scope: "account", subject: email }).delete();
  try {
    expect((await signInVia(A, email, "wrong-1")).error).toBe("CredentialsSignin");
    expect((await signInVia(B, email, "wrong-2")).error).toBe("CredentialsSignin");
    expect((await signInVia(A, email, "wrong-3")).error).toBe("CredentialsSignin");
    for (const base of [B, A]) {
      const right = await signInVia(base, email, DEMO_PASSWORD);
      expect(right.cookie).toBeNull();
      expect(right.error).toContain("Too many failed password attempts for this account");
    }
    expect(Number((await db("auth_attempts").where({ scope: "account", subject: email }).first("failures"))?.failures)).toBeGreaterThanOrEqual(LOCK_AFTER);
  } finally {
    await db("auth_attempts").where({ scope: "account", subject: email }).delete();
  }
});

async function reviewerPage(browser: import("@playwright/test").Browser, base: string, email: string, path: string): Promise<Page> {
  const { cookie } = await signInVia(base, email, DEMO_PASSWORD);
  expect(cookie, `${email} signs in on ${base}`).not.toBeNull();
  const context = await browser.newContext({ baseURL: base });
  await context.addCookies(cookie!.split("; ").map((pair) => ({ name: pair.slice(0, pair.indexOf("=")), value: pair.slice(pair.indexOf("=") + 1), url: base })));
  const page = await context.newPage();
  await page.goto(path);
  return page;
}

test("two reviewers signing off one version at once on different instances: one signature, the other told who signed; the mail goes out once with two senders", async ({ browser }) => {
  test.setTimeout(120_000);
  const title = `Two-instance sign-off ${Date.now()}`;
  const data = await approvedProtocolWithDraft({ title, author: DEMO.developer, signer: "rhea.qa@example.test", password: DEMO_PASSWORD });
  const v2 = await db("protocol_versions").where({ protocol_id: data.protocolId, number: 2 }).first("id", "lock_version", "author_id");
  const author = (await findUserById(Number(v2.author_id)))!;
  await submitVersion({ id: author.id, email: author.email, name: author.name, role: author.role }, { versionId: Number(v2.id), lockVersion: Number(v2.lock_version) });

  const path = `/protocols/${data.protocolId}/versions/2`;
  const quinn = await reviewerPage(browser, A, DEMO.reviewer, path);
  const rhea = await reviewerPage(browser, B, "rhea.qa@example.test", path);
  for (const page of [quinn, rhea]) {
    await expect(page.getByTestId("version-state")).toHaveText("In review");
    await page.getByLabel("Meaning of your signature").selectOption("Approved for bench use");
    await page.getByLabel("Your password").fill(DEMO_PASSWORD);
    await expect(page.getByRole("button", { name: "Sign off version 2" })).toBeEnabled();
  }
  await Promise.all([quinn, rhea].map((page) => page.getByRole("button", { name: "Sign off version 2" }).click()));

  const signatures = async () => db("signatures").where({ version_id: v2.id }).join("users", "users.id", "signatures.signer_id").select("users.name");
  await expect.poll(async () => (await signatures()).length, { timeout: 20_000 }).toBe(1);
  const [{ name: signer }] = await signatures();
  const loser = signer === "Quinn Abara" ? rhea : quinn;
  await expect(loser.getByTestId("approve-status")).toContainText(`Version 2 is already approved by ${signer}`, { timeout: 20_000 });
  await expect(loser.getByTestId("approve-status")).toContainText("nothing was changed");
  expect(await db("protocol_versions").where({ id: v2.id }).first("state")).toEqual({ state: "approved" });
  expect((await db("audit_events").where({ entity_type: "protocol_version", entity_id: String(v2.id), action: "protocol_version.approve" })).length).toBe(1);

  const subject = `Signed off: ${data.code} version 2 — ${title}`;
  const delivered = () => readCapturedMail(process.env.MAIL_SINK_DIR ?? "").filter((m) => m.to.includes(DEMO.supervisor) && subjectOf(m.raw) === subject).length;
  await expect.poll(delivered, { timeout: 30_000, message: `"${subject}" reaches the SMTP sink` }).toBe(1);
  const outbox = () => db("mail_outbox").where({ subject, to_address: DEMO.supervisor }).select("status", "attempts");
  await expect.poll(async () => (await outbox()).map((r) => r.status), { timeout: 10_000 }).toEqual(["sent"]);
  await new Promise((r) => setTimeout(r, 3_000));
  expect(delivered()).toBe(1);
  await quinn.context().close();
  await rhea.context().close();
});
