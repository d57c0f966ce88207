"use client";

import { useState, useTransition } from "react";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/auth/roles";
import { setActiveAction, setRoleAction } from "@/lib/users/actions";

interface Props {
  user: { id: number; name: string; email: string; role: Role; active: boolean };
  self: boolean;
}

/** One account: role picker and activate/deactivate, each saved by a server action. */
export function UserRow({ user, self }: Props) {
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();

  function run(action: (f: FormData) => Promise<{ ok: boolean; message?: string }>, fields: Record<string, string>) {
    const form = new FormData();
    for (const [k, v] of Object.entries(fields)) form.set(k, v);
    start(async () => {
      const result = await action(form);
      setMessage({ ok: result.ok, text: result.message ?? "" });
    });
  }

  return (
    <tr data-testid={`user-${user.email}`}>
      <td>{user.name}{self && <span className="ml-1 text-xs text-ink-muted">(you)</span>}</td>
      <td>{user.email}</td>
      <td>
        <select
          aria-label={`Role of ${user.email}`}
          className="input py-1"
          defaultValue={user.role}
          disabled={self || pending}
          onChange={(e) => {
            const role = e.target.value as Role;
            if (!window.confirm(`Change ${user.email} from ${ROLE_LABELS[user.role]} to ${ROLE_LABELS[role]}? What they can see and do changes at their next request.`)) {
              e.target.value = user.role;
              return;
            }
            run(setRoleAction, { userId: String(user.id), role });
          }}
        >
          {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
        </select>
      </td>
      <td>
        <span className={`pill ${user.active ? "border-moss/40 bg-moss-light text-moss-dark" : "border-paper-line bg-paper-deep text-ink-muted"}`}>
          {user.active ? "Active" : "Deactivated"}
        </span>
        {message && <p className={`mt-1 text-xs ${message.ok ? "text-moss-dark" : "text-danger"}`} role="status">{message.text}</p>}
      </td>
      <td className="text-right">
        {!self && (
          <button
            type="button"
            className={user.active ? "btn-quiet" : "btn"}
            disabled={pending}
            onClick={() => {
              if (user.active && !window.confirm(`Deactivate ${user.email}? They are signed out and can no longer sign in until reactivated.`)) return;
              run(setActiveAction, { userId: String(user.id), active: String(!user.active) });
            }}
          >
            {user.active ? "Deactivate" : "Reactivate"}
          </button>
        )}
      </td>
    </tr>
  );
}
