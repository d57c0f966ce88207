import type { Metadata } from "next";
import { ChangePasswordForm } from "@/components/settings/change-password-form";
import { TokenPanel } from "@/components/settings/token-panel";
import { can, ROLE_LABELS } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { listTokensOfUser } from "@/lib/tokens/service";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage() {
  const user = await requirePageUser();
  const tokens = can(user.role, "api.compute") ? await listTokensOfUser(user.id) : [];
  return (
    <div className="max-w-3xl space-y-6">
      <header>
        <h1>Settings</h1>
        <p className="mt-1 text-ink-soft">{user.name} · {user.email} · {ROLE_LABELS[user.role]}</p>
      </header>
      <section className="card">
        <h2 className="mb-1">Password</h2>
        <p className="mb-3 text-sm text-ink-soft">Only you choose your password. Changing it signs out your other sessions and e-mails you a notice.</p>
        <ChangePasswordForm />
      </section>
      {can(user.role, "api.compute") ? (
        <TokenPanel
          tokens={tokens.map((t) => ({
            id: t.id,
            label: t.label,
            prefix: t.prefix,
            createdAt: t.createdAt.toISOString(),
            lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
            revoked: t.revokedAt !== null,
          }))}
        />
      ) : (
        <p className="card text-sm text-ink-soft">Your role does not use the computation API, so there are no API tokens to manage.</p>
      )}
    </div>
  );
}
