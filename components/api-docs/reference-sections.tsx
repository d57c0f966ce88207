import Link from "next/link";
import { ERROR_RESPONSES } from "@/lib/api/openapi";
import { CodeBlock } from "./code-block";

/** How to authenticate: a personal token from Settings, or the session in this browser. */
export function AuthSection({ baseUrl }: { baseUrl: string }) {
  return (
    <section className="card space-y-3 text-sm leading-relaxed" aria-labelledby="auth-title">
      <h2 id="auth-title">Signing your requests</h2>
      <p>
        From a script or notebook, send a personal API token. Make one on <Link href="/settings">Settings</Link>: give it a
        label, copy the token (it starts with <code>sw_</code> and is shown only once; only a hash is kept) and revoke it
        there when you no longer need it.
      </p>
      <CodeBlock caption="shell">{`export SIEVEWRIGHT_TOKEN=sw_…   # from Settings\ncurl -sS ${baseUrl}/api/v1/openapi.json | head -c 200`}</CodeBlock>
      <p>
        Every compute call carries <code>Authorization: Bearer $SIEVEWRIGHT_TOKEN</code>. In this browser the buttons below
        use your signed-in session instead, so they need no token. Assay developers, QA reviewers and supervisors may call
        the API; technician and admin accounts are refused with 403.
      </p>
    </section>
  );
}

/** The error format and each status code the API answers with; `example` is a real 400 body from the server. */
export function ErrorsSection({ example }: { example: unknown }) {
  return (
    <section className="card space-y-3 text-sm leading-relaxed" aria-labelledby="errors-title">
      <h2 id="errors-title">When a request is refused</h2>
      <p>
        Every error is JSON with a machine-readable <code>error</code> code and a <code>message</code> in words. A refused
        body (400) also lists <code>issues</code>: one entry per field, with its <code>path</code> and what is wrong, the
        value given and the range allowed. Numbers must be finite: JSON cannot carry NaN or Infinity, and a literal such as
        <code> 1e400</code> (which reads as Infinity) is refused like any other out-of-range value.
      </p>
      <table>
        <thead><tr><th>Status</th><th>error</th><th>When</th></tr></thead>
        <tbody>
          {Object.entries(ERROR_RESPONSES).map(([status, e]) => (
            <tr key={status}><td className="font-mono">{status}</td><td className="font-mono">{e.code}</td><td>{e.description}</td></tr>
          ))}
        </tbody>
      </table>
      <CodeBlock caption="the 400 answer to the spectra example with a radius of −5 µm">{JSON.stringify(example, null, 2)}</CodeBlock>
    </section>
  );
}

/** The per-token and per-user rate limits. */
export function RateLimitSection({ perMinute, perSessionMinute, maxTokens }: { perMinute: number; perSessionMinute: number; maxTokens: number }) {
  return (
    <section className="card space-y-2 text-sm leading-relaxed" aria-labelledby="rate-title">
      <h2 id="rate-title">Rate limit</h2>
      <p>
        Each token may make <strong data-testid="rate-limit">{perMinute}</strong> requests per calendar minute (server
        setting <code>RATE_LIMIT_PER_MINUTE</code>); calls made with the browser session may make{" "}
        <strong data-testid="rate-limit-session">{perSessionMinute}</strong> per user and minute (server setting{" "}
        <code>RATE_LIMIT_SESSION_PER_MINUTE</code>). Beyond that the answer is 429 with a <code>Retry-After</code> header
        giving the seconds until the next minute starts. The count is kept in the database, so it holds across several app
        instances. One account may hold at most {maxTokens} live tokens at a time; revoke one to create another.
      </p>
    </section>
  );
}
