import "./load-env";
import { spawnSync } from "node:child_process";
import { chromium, type Browser } from "@playwright/test";
import mysql from "mysql2/promise";

/**
 * npm run attack [-- BASE_URL] — tries, as a hostile user would, every attack of the security review against a running
 * Sievewright (default APP_BASE_URL from the environment or .env) and prints PASS or FAIL per attack with its evidence.
 * Exit code 0 when every attack failed to get through, 1 otherwise.
 *
 * It uses the demo accounts (password sievewright-demo) and the app's own database account from .env (DB_*), never the
 * migrator's. It changes the target: lee.dev@ and rhea.qa@ end up locked for AUTH_LOCK_MINUTES, sam.super@ holds up to
 * 10 API tokens, one control run record is stored, and sessions are opened and closed. Run it against a demo or test
 * installation, never against one in use. Takes about a minute (the lockout waits out the growing delays).
 */

const BASE = (process.argv.slice(2).find((a) => !a.startsWith("--")) ?? process.env.APP_BASE_URL ?? "http://127.0.0.1:3000").replace(/\/+$/, "");
const ORIGIN = new URL(BASE).origin;
const FOREIGN = `${new URL(BASE).protocol}//${new URL(BASE).hostname}:${Number(new URL(BASE).port || 80) + 1}`;
const PASSWORD = "sievewright-demo";
const USERS = {
  developer: "dana.dev@example.test",
  lockTarget: "lee.dev@example.test",
  reviewer: "quinn.qa@example.test",
  signTarget: "rhea.qa@example.test",
  technician: "tomas.tech@example.test",
  supervisor: "sam.super@example.test",
  admin: "ari.admin@example.test",
};

type Result = { name: string; pass: boolean; evidence: string[] };
const results: Result[] = [];

/** Records one attack's outcome and prints it at once. */
function report(name: string, pass: boolean, evidence: string[]): void {
  results.push({ name, pass, evidence });
  console.log(`${pass ? "PASS" : "FAIL"}  ${name}`);
  for (const e of evidence) console.log(`      ${e}`);
}

/** Runs one attack; an exception is a FAIL with its message (the attack could not be judged). */
async function attack(name: string, run: () => Promise<{ pass: boolean; evidence: string[] }>): Promise<void> {
  try {
    const { pass, evidence } = await run();
    report(name, pass, evidence);
  } catch (err) {
    report(name, false, [`could not complete: ${err instanceof Error ? err.message : String(err)}`]);
  }
}

/** A client with its own cookies, like one browser. */
class Client {
  cookies = new Map<string, string>();

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  async fetch(path: string, init: RequestInit & { cookie?: string } = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    const cookie = init.cookie ?? this.cookieHeader();
    if (cookie) headers.set("cookie", cookie);
    const res = await fetch(path.startsWith("http") ? path : `${BASE}${path}`, { ...init, headers, redirect: "manual" });
    for (const c of res.headers.getSetCookie()) {
      const [pair, ...attrs] = c.split(";");
      const i = pair.indexOf("=");
      const name = pair.slice(0, i).trim();
      const value = pair.slice(i + 1).trim();
      const expired = attrs.some((a) => /max-age=0\b/i.test(a) || /expires=Thu, 01 Jan 1970/i.test(a));
      if (expired || value === "") this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return res;
  }

  /** next-auth's credentials sign-in; returns the status and the URL next-auth would send the browser to. */
  async signIn(email: string, password: string, callbackUrl = `${BASE}/home`): Promise<{ status: number; url: string; error: string | null }> {
    const { csrfToken } = (await (await this.fetch("/api/auth/csrf")).json()) as { csrfToken: string };
    const res = await this.fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded", origin: ORIGIN },
      body: new URLSearchParams({ csrfToken, email, password, callbackUrl, json: "true" }).toString(),
    });
    const body = (await res.json().catch(() => ({}))) as { url?: string };
    const url = body.url ?? res.headers.get("location") ?? "";
    let error: string | null = null;
    try {
      error = new URL(url, BASE).searchParams.get("error");
    } catch {
      error = null;
    }
    return { status: res.status, url, error };
  }

  async signOut(): Promise<number> {
    const { csrfToken } = (await (await this.fetch("/api/auth/csrf")).json()) as { csrfToken: string };
    const res = await this.fetch("/api/auth/signout", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded", origin: ORIGIN },
      body: new URLSearchParams({ csrfToken, json: "true" }).toString(),
    });
    return res.status;
  }

  async sessionUser(cookie?: string): Promise<string | null> {
    const res = await this.fetch("/api/auth/session", { cookie });
    const body = (await res.json().catch(() => null)) as { user?: { email?: string } } | null;
    return body?.user?.email ?? null;
  }
}

async function signedIn(email: string): Promise<Client> {
  const c = new Client();
  const r = await c.signIn(email, PASSWORD);
  if (r.status !== 200 || r.error) throw new Error(`sign-in of ${email} failed: ${r.status} ${r.error ?? r.url}`);
  return c;
}

function dbConnection() {
  return mysql.createConnection({
    host: process.env.DB_HOST ?? "127.0.0.1",
    port: Number(process.env.DB_PORT ?? 3307),
    user: process.env.DB_USER ?? "sievewright",
    password: process.env.DB_PASSWORD ?? "sievewright-local",
    database: process.env.DB_NAME ?? "sievewright",
  });
}

/** Audit rows of one action whose text mentions `needle`, read through the product's own CSV export. */
async function auditRows(supervisor: Client, action: string, needle: string): Promise<string[]> {
  const res = await supervisor.fetch(`/api/v1/audit.csv?action=${encodeURIComponent(action)}`);
  if (res.status !== 200) throw new Error(`audit.csv answered ${res.status}`);
  const lines = (await res.text()).split(/\r?\n/).slice(1);
  return lines.filter((l) => l.includes(`,${action},`) && l.includes(needle));
}

const HEADER_RULES: [string, (v: string | null) => boolean][] = [
  ["content-security-policy", (v) => !!v && /frame-ancestors 'none'/.test(v) && !/unsafe-eval/.test(v) && /default-src '(self|none)'/.test(v)],
  ["x-content-type-options", (v) => v === "nosniff"],
  ["referrer-policy", (v) => v === "same-origin"],
  ["permissions-policy", (v) => !!v && /camera=\(\)/.test(v)],
  ["x-frame-options", (v) => v === "DENY"],
];

function checkHeaders(label: string, res: Response): { ok: boolean; lines: string[] } {
  const missing = HEADER_RULES.filter(([name, rule]) => !rule(res.headers.get(name))).map(([name]) => `${name}=${JSON.stringify(res.headers.get(name))}`);
  const csp = res.headers.get("content-security-policy") ?? "";
  return {
    ok: missing.length === 0,
    lines: [`${label}: ${res.status} ${res.headers.get("content-type") ?? ""}; ${missing.length ? `BAD ${missing.join(", ")}` : `all headers present; CSP "${csp.slice(0, 90)}…"`}`],
  };
}

/** A run record in lab units for a version (the same fields as the bench form). */
function runForm(versionId: number, lot: string): FormData {
  const form = new FormData();
  form.set("run", JSON.stringify({ versionId, bufferLot: lot, conductivityUsPerCm: "98", measuredAtC: "24", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14.1" }));
  return form;
}

async function main(): Promise<number> {
  console.log(`Sievewright attack run against ${BASE} at ${new Date().toISOString()}`);
  const csrf = await fetch(`${BASE}/api/auth/csrf`).catch((e: Error) => e);
  if (csrf instanceof Error || !csrf.ok) {
    console.error(`Cannot reach ${BASE}: ${csrf instanceof Error ? csrf.message : csrf.status}`);
    return 2;
  }
  const supervisor = await signedIn(USERS.supervisor);
  const technician = await signedIn(USERS.technician);
  const benchHtml = await (await technician.fetch("/bench")).text();
  const approvedVersionId = Number(/\/bench\/(\d+)/.exec(benchHtml)?.[1]);
  const sheet = /\/api\/v1\/protocols\/\d+\/versions\/\d+\/bench-sheet/.exec(benchHtml)?.[0] ?? null;

  await attack("security headers on a page, an API answer and downloads", async () => {
    const lines: string[] = [];
    let ok = true;
    const targets: [string, Client, string][] = [
      ["page /login", new Client(), "/login"],
      ["page /home (signed in)", supervisor, "/home"],
      ["API /api/v1/openapi.json", new Client(), "/api/v1/openapi.json"],
      ["API 401 /api/v1/audit.csv (signed out)", new Client(), "/api/v1/audit.csv"],
      ["download /api/v1/audit.csv", supervisor, "/api/v1/audit.csv?action=auth.signin"],
    ];
    if (sheet) targets.push(["download bench sheet PDF", technician, sheet]);
    else {
      ok = false;
      lines.push("no bench-sheet link on the technician's /bench page");
    }
    for (const [label, client, path] of targets) {
      const r = checkHeaders(label, await client.fetch(path));
      ok &&= r.ok;
      lines.push(...r.lines);
    }
    return { pass: ok, evidence: lines };
  });

  await attack("open redirect through callbackUrl after a real sign-in", async () => {
    const variants = [
      "/\\evil.example/",
      decodeURIComponent("%2F%5Cevil.example%2F"),
      "/\t/evil.example/",
      decodeURIComponent("/%09/evil.example/"),
      "//evil.example",
      "//evil.example/%2F..",
      "///evil.example",
      "\\\\evil.example",
      "/%2F/evil.example",
      "/%5Cevil.example",
      " //evil.example",
      "/\n/evil.example",
      "https://evil.example/",
      "http:evil.example",
      "https:/\\evil.example",
      `${ORIGIN}@evil.example/`,
      "javascript:alert(document.cookie)",
      "data:text/html,<script>alert(1)</script>",
      "evil.example",
    ];
    const bad: string[] = [];
    for (const v of variants) {
      const c = new Client();
      const r = await c.signIn(USERS.developer, PASSWORD, v);
      let origin = "";
      try {
        origin = new URL(r.url, BASE).origin;
      } catch {
        origin = "unparsable";
      }
      if (r.status !== 200 || origin !== ORIGIN || /evil\.example|javascript:|data:/i.test(r.url)) bad.push(`${JSON.stringify(v)} → ${r.status} ${r.url}`);
      // signed in, the sign-in page with the same callbackUrl must not send the browser off-site either
      const page = await c.fetch(`/login?callbackUrl=${encodeURIComponent(v)}`);
      const loc = page.headers.get("location");
      if (loc && (new URL(loc, BASE).origin !== ORIGIN || /evil\.example/.test(loc))) bad.push(`GET /login?callbackUrl=${JSON.stringify(v)} → ${page.status} ${loc}`);
      await c.signOut();
    }
    return {
      pass: bad.length === 0,
      evidence: bad.length ? bad : [`${variants.length} variants after a successful sign-in of ${USERS.developer}: every destination stayed on ${ORIGIN} (signed-in GET /login too)`],
    };
  });

  await attack("sign-out ends the session: a copied session cookie is dead afterwards", async () => {
    const c = await signedIn(USERS.developer);
    const copied = c.cookieHeader();
    const before = await c.fetch("/api/v1/library/buffers/export", { cookie: copied });
    const status = await c.signOut();
    const api = await c.fetch("/api/v1/library/buffers/export", { cookie: copied });
    const page = await c.fetch("/home", { cookie: copied });
    const session = await c.sessionUser(copied);
    const pageOut = page.status >= 300 && page.status < 400 && /\/login/.test(page.headers.get("location") ?? "");
    return {
      pass: before.status === 200 && api.status === 401 && pageOut && session === null,
      evidence: [
        `before sign-out: GET /api/v1/library/buffers/export → ${before.status}`,
        `sign-out → ${status}; replayed cookie: API → ${api.status}, /home → ${page.status} ${page.headers.get("location") ?? ""}, /api/auth/session user → ${session ?? "none"}`,
      ],
    };
  });

  const db = await dbConnection();
  try {
    await attack("cross-origin state changes with a cookie session are refused", async () => {
      const developer = await signedIn(USERS.developer);
      const count = async (table: string) => Number(((await db.query(`SELECT COUNT(*) AS n FROM ${table}`)) as [{ n: number }[], unknown])[0][0].n);
      const runsBefore = await count("bench_runs");
      const buffersBefore = await count("buffers");
      const tries: [string, Client, string, RequestInit, number[]][] = [
        [`POST /api/v1/runs multipart, Origin ${FOREIGN}`, technician, "/api/v1/runs", { method: "POST", headers: { origin: FOREIGN }, body: runForm(approvedVersionId, "ATTACK-FOREIGN") }, [403]],
        ["POST /api/v1/runs, no Origin, Sec-Fetch-Site: cross-site", technician, "/api/v1/runs", { method: "POST", headers: { "sec-fetch-site": "cross-site" }, body: runForm(approvedVersionId, "ATTACK-NOORIGIN") }, [403]],
        ["POST /api/v1/runs, Origin null (sandboxed frame)", technician, "/api/v1/runs", { method: "POST", headers: { origin: "null" }, body: runForm(approvedVersionId, "ATTACK-NULL") }, [403]],
        [`POST /api/v1/runs text/plain, Origin ${FOREIGN}`, technician, "/api/v1/runs", { method: "POST", headers: { origin: FOREIGN, "content-type": "text/plain" }, body: "run=x" }, [403, 415]],
        [`POST /api/v1/library/buffers/import text/plain, Origin ${FOREIGN}`, developer, "/api/v1/library/buffers/import", { method: "POST", headers: { origin: FOREIGN, "content-type": "text/plain" }, body: JSON.stringify({ items: [{ name: "Planted buffer" }] }) }, [403, 415]],
        ["POST /api/v1/library/buffers/import text/plain, same Origin", developer, "/api/v1/library/buffers/import", { method: "POST", headers: { origin: ORIGIN, "content-type": "text/plain" }, body: JSON.stringify({ items: [{ name: "Planted buffer" }] }) }, [415]],
      ];
      const lines: string[] = [];
      let ok = true;
      for (const [label, client, path, init, expected] of tries) {
        const res = await client.fetch(path, init);
        const body = (await res.text()).slice(0, 110).replace(/\s+/g, " ");
        const good = expected.includes(res.status);
        ok &&= good;
        lines.push(`${good ? "refused" : "NOT REFUSED"}: ${label} → ${res.status} ${body}`);
      }
      const runsAfter = await count("bench_runs");
      const buffersAfter = await count("buffers");
      ok &&= runsAfter === runsBefore && buffersAfter === buffersBefore;
      lines.push(`rows: bench_runs ${runsBefore} → ${runsAfter}, buffers ${buffersBefore} → ${buffersAfter}`);
      const control = await technician.fetch("/api/v1/runs", { method: "POST", headers: { origin: ORIGIN }, body: runForm(approvedVersionId, "ATTACK-CONTROL") });
      ok &&= control.status === 201;
      lines.push(`control: the same run from ${ORIGIN} → ${control.status} (so the refusals above are about the origin, not the body)`);
      return { pass: ok, evidence: lines };
    });

    await attack("the app's database account cannot rewrite the audit trail or signatures", async () => {
      const [[trig]] = (await db.query("SELECT COUNT(*) AS n FROM information_schema.TRIGGERS WHERE TRIGGER_SCHEMA = DATABASE()")) as unknown as [{ n: number }[]];
      const statements = [
        "UPDATE audit_events SET summary = 'forged' ORDER BY id DESC LIMIT 1",
        "DELETE FROM audit_events ORDER BY id DESC LIMIT 1",
        "UPDATE signatures SET meaning = 'forged' LIMIT 1",
        "DELETE FROM signatures LIMIT 1",
        "TRUNCATE TABLE audit_events",
        "TRUNCATE TABLE signatures",
        "DROP TRIGGER audit_events_no_update",
        "DROP TRIGGER IF EXISTS audit_events_no_delete",
        "CREATE TRIGGER attack_t BEFORE INSERT ON audit_events FOR EACH ROW SET NEW.summary = NEW.summary",
        "ALTER TABLE audit_events ADD COLUMN attack_col INT",
        "DROP TABLE signatures",
        "CREATE TABLE attack_t (id INT)",
        "UPDATE protocol_versions SET content_json = JSON_OBJECT('forged', 1) WHERE state = 'approved' LIMIT 1",
        "GRANT ALL PRIVILEGES ON *.* TO CURRENT_USER()",
      ];
      const lines: string[] = [];
      let ok = true;
      for (const sql of statements) {
        await db.query("START TRANSACTION");
        try {
          await db.query(sql);
          ok = false;
          lines.push(`ALLOWED: ${sql}`);
        } catch (err) {
          const e = err as { code?: string; sqlMessage?: string };
          const refused = /DENIED|ACCESS|SIGNAL|ER_SIGNAL_EXCEPTION|ER_SPECIFIC_ACCESS|ER_TRG_DOES_NOT_EXIST/i.test(`${e.code} ${e.sqlMessage}`) || e.code === "ER_SIGNAL_EXCEPTION";
          ok &&= refused;
          lines.push(`${refused ? "refused" : "ERROR?"}: ${sql} → ${e.code}: ${(e.sqlMessage ?? "").slice(0, 90)}`);
        } finally {
          await db.query("ROLLBACK");
        }
      }
      lines.push(`triggers visible to the app account: ${trig.n} (it holds no TRIGGER privilege)`);
      return { pass: ok, evidence: lines };
    });
  } finally {
    await db.end();
  }

  await attack("npm run audit:verify reports an intact chain", async () => {
    const out = spawnSync(process.execPath, ["--import", "tsx", "scripts/audit-verify.ts"], { encoding: "utf8", env: process.env });
    const text = `${out.stdout}${out.stderr}`.trim().split("\n").slice(-3);
    const page = await (await supervisor.fetch("/audit")).text();
    const shown = /Hash chain intact/.test(page);
    return { pass: out.status === 0 && /chain intact/.test(out.stdout) && shown, evidence: [`exit ${out.status}`, ...text, `/audit page says "Hash chain intact": ${shown}`] };
  });

  await attack("supervisor: /review and /bench read-only", async () => {
    const lines: string[] = [];
    let ok = true;
    for (const path of ["/review", "/bench", `/bench/${approvedVersionId}`]) {
      const res = await supervisor.fetch(path);
      const html = await res.text();
      const actions = ["Sign off version", "Return to author", "Record run", "Record a run", 'name="password"'].filter((w) => html.includes(w));
      const good = res.status === 200 && actions.length === 0 && /<h1/.test(html);
      ok &&= good;
      lines.push(`GET ${path} → ${res.status}; action controls: ${actions.length ? actions.join(", ") : "none"}`);
    }
    const post = await supervisor.fetch("/api/v1/runs", { method: "POST", headers: { origin: ORIGIN }, body: runForm(approvedVersionId, "ATTACK-SUPERVISOR") });
    ok &&= post.status === 403;
    lines.push(`POST /api/v1/runs as the supervisor → ${post.status}`);
    return { pass: ok, evidence: lines };
  });

  let browser: Browser | null = null;
  try {
    browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu"] });

    await attack("at most 10 live API tokens per user (the 11th is refused)", async () => {
      const context = await browser!.newContext({ baseURL: BASE });
      const page = await context.newPage();
      await page.goto("/login");
      await page.getByLabel("Email").fill(USERS.supervisor);
      await page.getByLabel("Password").fill(PASSWORD);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL(/\/home/);
      await page.goto("/settings");
      const messages: string[] = [];
      let refusedAt = 0;
      const liveTokens = async () => {
        const db = await dbConnection();
        try {
          const [rows] = (await db.query("SELECT COUNT(*) AS n FROM api_tokens t JOIN users u ON u.id = t.user_id WHERE u.email = ? AND t.revoked_at IS NULL", [USERS.supervisor])) as unknown as [{ n: number }[]];
          return Number(rows[0].n);
        } finally {
          await db.end();
        }
      };
      const before = await liveTokens();
      for (let i = 1; i <= 12; i++) {
        await page.getByLabel("Label").fill(`attack token ${i}`);
        const answered = page.waitForResponse((r) => r.request().method() === "POST" && r.url().includes("/settings"));
        await page.getByRole("button", { name: "Create token" }).click();
        await answered;
        await page.getByRole("button", { name: "Create token" }).isEnabled();
        await page.waitForTimeout(500);
        const text = ((await page.locator('p[role="status"]').textContent()) ?? "").trim();
        messages.push(text);
        if (/most allowed|Revoke one/i.test(text)) {
          refusedAt = i;
          break;
        }
      }
      await context.close();
      const after = await liveTokens();
      return {
        pass: refusedAt > 0 && after === 10,
        evidence: [
          `${USERS.supervisor} held ${before} live token(s); ${Math.max(0, refusedAt - 1)} more created, then attempt ${refusedAt || "none"} refused: "${messages.at(-1)}"`,
          `live tokens afterwards (api_tokens): ${after}`,
        ],
      };
    });

    await attack("API rate limit for cookie-session callers (per user)", async () => {
      const reviewer = await signedIn(USERS.reviewer);
      let n = 0;
      let limited: Response | null = null;
      while (!limited && n < 2000) {
        const batch = await Promise.all(Array.from({ length: 10 }, () => reviewer.fetch("/api/v1/library/devices/export")));
        n += batch.length;
        limited = batch.find((r) => r.status === 429) ?? null;
        for (const r of batch) if (r !== limited) await r.arrayBuffer();
      }
      const body = limited ? await limited.text() : "";
      return {
        pass: !!limited && !!limited.headers.get("retry-after"),
        evidence: [limited ? `429 after ≤${n} requests in the minute; Retry-After: ${limited.headers.get("retry-after")}; ${body.slice(0, 140)}` : `no 429 in ${n} requests`],
      };
    });

    await attack("wrong e-signature passwords are limited and audited", async () => {
      const context = await browser!.newContext({ baseURL: BASE });
      const page = await context.newPage();
      await page.goto("/login");
      await page.getByLabel("Email").fill(USERS.signTarget);
      await page.getByLabel("Password").fill(PASSWORD);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL(/\/home/);
      await page.goto("/review");
      await page.getByRole("link", { name: /Quarry Hill|QH-|Open/ }).first().click();
      const statuses: string[] = [];
      for (let i = 0; i < 12; i++) {
        await page.getByLabel("Meaning of your signature").selectOption({ index: 1 }).catch(() => undefined);
        const button = page.getByRole("button", { name: /Sign off version/ });
        // the button enables once the page is interactive and a password is typed: type until it does
        for (let t = 0; t < 50 && !(await button.isEnabled()); t++) {
          await page.getByLabel("Your password").fill(`wrong-guess-${i}`);
          if (!(await button.isEnabled())) await page.waitForTimeout(200);
        }
        const answered = page.waitForResponse((r) => r.request().method() === "POST" && !r.url().includes("/api/"));
        await button.click();
        await answered;
        const status = page.getByTestId("approve-status");
        await status.waitFor();
        await page.waitForTimeout(300);
        statuses.push(((await status.textContent()) ?? "").trim());
      }
      const state = ((await page.getByTestId("version-state").textContent()) ?? "").trim();
      await context.close();
      const failed = await auditRows(supervisor, "signature.password_failed", USERS.signTarget);
      const refused = await auditRows(supervisor, "signature.refused", USERS.signTarget);
      const limitedMsg = statuses.find((s) => /Too many failed password attempts/.test(s));
      return {
        pass: !!limitedMsg && /Try again in/.test(limitedMsg) && state === "In review" && failed.length > 0 && refused.length > 0,
        evidence: [
          `12 wrong passwords by ${USERS.signTarget}: ${statuses.filter((s) => /not your current password/.test(s)).length} checked and wrong, ${statuses.filter((s) => /Too many/.test(s)).length} refused unchecked`,
          `refusal: "${limitedMsg ?? "none"}"`,
          `version state afterwards: ${state}; audit rows: signature.password_failed ${failed.length}, signature.refused ${refused.length}`,
        ],
      };
    });
  } finally {
    await browser?.close();
  }

  await attack("60 wrong sign-in passwords, then the right one: locked, says when to retry, audited", async () => {
    const c = new Client();
    let checked = 0;
    let refused = 0;
    let waited = 0;
    for (let i = 0; i < 60; i++) {
      const r = await c.signIn(USERS.lockTarget, `guess-${i}`);
      const msg = r.error ?? "";
      if (/Too many failed/.test(msg)) {
        refused++;
        const secs = Number(/Try again in (\d+) s\b/.exec(msg)?.[1] ?? NaN);
        // a patient guesser waits out short delays, so the lock is reached rather than only the delay
        if (Number.isFinite(secs) && secs <= 20 && waited < 60) {
          await new Promise((res) => setTimeout(res, (secs + 0.3) * 1000));
          waited += secs;
        }
      } else checked++;
    }
    const right = await c.signIn(USERS.lockTarget, PASSWORD);
    const lockouts = await auditRows(supervisor, "auth.lockout", USERS.lockTarget);
    const failures = await auditRows(supervisor, "auth.signin_failed", USERS.lockTarget);
    const refusals = await auditRows(supervisor, "auth.signin_refused", USERS.lockTarget);
    const message = right.error ?? "";
    return {
      pass: right.status !== 200 || !!right.error ? /Too many failed password attempts for this account/.test(message) && /Try again in/.test(message) && lockouts.length > 0 && failures.length >= 10 : false,
      evidence: [
        `60 wrong passwords for ${USERS.lockTarget}: ${checked} checked, ${refused} refused unchecked (waited ${waited} s of growing delays)`,
        `right password afterwards → ${right.status}, "${message}"`,
        `audit rows: auth.signin_failed ${failures.length}, auth.lockout ${lockouts.length}, auth.signin_refused ${refusals.length}`,
      ],
    };
  });

  const failed = results.filter((r) => !r.pass);
  console.log(`\n${results.length - failed.length} PASS, ${failed.length} FAIL${failed.length ? `: ${failed.map((f) => f.name).join("; ")}` : ""}`);
  return failed.length ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(`attack run failed: ${err instanceof Error ? err.stack : String(err)}`);
    process.exit(2);
  },
);
