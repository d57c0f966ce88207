import Link from "next/link";
import type { Role } from "@/lib/auth/roles";

interface Task {
  title: string;
  body: string;
  href: string;
  action: string;
}

const HOME: Record<Role, { heading: string; intro: string; tasks: Task[] }> = {
  developer: {
    heading: "Assay development",
    intro: "Model two populations, sweep frequency against medium conductivity, and turn a good operating window into a protocol draft.",
    tasks: [
      { title: "Plan a separation", body: "Pick a live/dead pair, a buffer and a device; get ranked operating windows with heating and flow warnings.", href: "/planner", action: "Open the planner" },
      { title: "Your protocols", body: "Drafts you are editing, versions in review, and what QA returned to you.", href: "/protocols", action: "See protocols" },
      { title: "Libraries", body: "Populations, buffers and device profiles; fit membrane parameters from measured crossovers.", href: "/library/populations", action: "Open libraries" },
    ],
  },
  reviewer: {
    heading: "Quality review",
    intro: "Check each submitted version against the last approved one, then sign it off or return it with comments.",
    tasks: [
      { title: "Review queue", body: "Versions waiting for your decision, oldest first. You cannot sign what you authored.", href: "/review", action: "Open the queue" },
      { title: "Audit trail", body: "Every change and signature, with who, what and when; exportable as CSV.", href: "/audit", action: "Open the audit trail" },
    ],
  },
  technician: {
    heading: "At the bench",
    intro: "Only approved, current protocol versions appear here. Print the bench sheet, run the sort, then record what you measured.",
    tasks: [
      { title: "Current protocols", body: "Signed versions ready for use, each with its bench sheet and run records.", href: "/bench", action: "Open the bench list" },
    ],
  },
  supervisor: {
    heading: "Oversight",
    intro: "See which protocol versions are in use and how their runs went. You are e-mailed whenever a version is signed off.",
    tasks: [
      { title: "Protocols in use", body: "Approved versions, their sign-offs and their bench runs.", href: "/protocols", action: "See protocols" },
      { title: "Audit trail", body: "The append-only record of every change and signature.", href: "/audit", action: "Open the audit trail" },
      { title: "Mail", body: "Notifications the system has sent or queued.", href: "/mail", action: "Open mail" },
    ],
  },
  admin: {
    heading: "Administration",
    intro: "Manage accounts and roles. Admins neither author nor sign protocols (separation of duties).",
    tasks: [
      { title: "Users and roles", body: "Create accounts, change roles, deactivate people who have left.", href: "/admin/users", action: "Manage users" },
      { title: "Audit trail", body: "Every change, including account changes.", href: "/audit", action: "Open the audit trail" },
    ],
  },
};

/** The landing page of each role: what the role does here, with a way into each task. */
export function RoleHome({ role, name, children }: { role: Role; name: string; children?: React.ReactNode }) {
  const home = HOME[role];
  return (
    <div className="max-w-5xl space-y-6" data-testid={`home-${role}`}>
      <header>
        <p className="text-sm text-ink-muted">Welcome, {name}</p>
        <h1>{home.heading}</h1>
        <p className="mt-2 max-w-2xl text-ink-soft">{home.intro}</p>
      </header>
      {children}
      <div className="grid gap-4 md:grid-cols-3">
        {home.tasks.map((t) => (
          <section key={t.href} className="card flex flex-col">
            <h2>{t.title}</h2>
            <p className="mt-2 flex-1 text-sm text-ink-soft">{t.body}</p>
            <p className="mt-4"><Link href={t.href} className="btn-quiet no-underline">{t.action}</Link></p>
          </section>
        ))}
      </div>
    </div>
  );
}
