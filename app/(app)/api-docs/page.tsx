import { readEnv } from "@/lib/env";
import type { Metadata } from "next";
import Link from "next/link";
import { AuthSection, ErrorsSection, RateLimitSection } from "@/components/api-docs/reference-sections";
import { RouteSection } from "@/components/api-docs/route-section";
import { sampleValidationError } from "@/lib/api/compute";
import { ROUTE_DOCS } from "@/lib/api/routes";
import { requirePageUser } from "@/lib/auth/session";
import { ENGINE_VERSION } from "@/lib/dielectric";
import { rateLimitFor } from "@/lib/http/rate-limit";
import { MAX_LIVE_TOKENS_PER_USER } from "@/lib/tokens/service";

export const metadata: Metadata = { title: "API" };

export default async function ApiDocsPage() {
  const user = await requirePageUser("api.compute");
  const baseUrl = readEnv().APP_BASE_URL;
  return (
    <div className="max-w-4xl space-y-6">
      <header className="space-y-2">
        <h1>Computation API</h1>
        <p className="leading-relaxed text-ink-soft">
          The planner&apos;s physics, callable from your own scripts: JSON in, JSON out, SI units both ways (m, S/m, F/m²,
          S/m², Hz; permittivities relative). Engine version <strong>{ENGINE_VERSION}</strong>. The machine-readable
          description is the <Link href="/api/v1/openapi.json">OpenAPI 3.1 document</Link>.
        </p>
        <nav aria-label="On this page" className="flex flex-wrap gap-3 text-sm">
          {ROUTE_DOCS.map((r) => <a key={r.path} href={`#${r.operationId}`} className="font-mono">{r.path}</a>)}
        </nav>
      </header>
      <AuthSection baseUrl={baseUrl} />
      {ROUTE_DOCS.map((r) => <RouteSection key={r.path} route={r} baseUrl={baseUrl} />)}
      <ErrorsSection example={await sampleValidationError().json()} />
      <RateLimitSection
        perMinute={rateLimitFor({ kind: "token", tokenId: 0 })}
        perSessionMinute={rateLimitFor({ kind: "user", userId: user.id })}
        maxTokens={MAX_LIVE_TOKENS_PER_USER}
      />
    </div>
  );
}
