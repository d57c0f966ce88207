import type { Metadata } from "next";
import { NewUserForm } from "@/components/admin/new-user-form";
import { UserRow } from "@/components/admin/user-row";
import { requirePageUser } from "@/lib/auth/session";
import { listUsers } from "@/lib/users/repo";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const admin = await requirePageUser("users.manage");
  const users = await listUsers();
  return (
    <div className="max-w-5xl space-y-6">
      <header>
        <h1>Users and roles</h1>
        <p className="mt-1 text-ink-soft">Roles decide what each person may do. A deactivated account cannot sign in; its history stays.</p>
      </header>
      <section className="card">
        <h2 className="mb-3">Accounts</h2>
        <table>
          <thead>
            <tr><th>Name</th><th>Email</th><th>Role</th><th>Status</th><th /></tr>
          </thead>
          <tbody>
            {users.map((u) => (
              <UserRow key={u.id} user={{ id: u.id, name: u.name, email: u.email, role: u.role, active: u.active }} self={u.id === admin.id} />
            ))}
          </tbody>
        </table>
      </section>
      <section className="card max-w-xl">
        <h2 className="mb-3">New account</h2>
        <NewUserForm />
      </section>
    </div>
  );
}
