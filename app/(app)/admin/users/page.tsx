import type { Metadata } from "next";
import { ActiveForm, AddUserForm, InviteUserForm, RolesForm, SetPasswordForm } from "@/components/admin/user-forms";
import { PageHeader, Refusal } from "@/components/ui/page-header";
import { StateTag } from "@/components/ui/status-badge";
import { pageContext } from "@/lib/auth/page-context";
import { listUsers } from "@/lib/services/users/list";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const { ctx, allowed } = await pageContext("users:manage");
  if (!allowed) return <Refusal message="Only administrators manage users and roles." />;
  const rows = listUsers(ctx);
  return (
    <>
      <PageHeader title="Users" sheet="People of this organisation and their roles" />
      <div className="sheet mb-6 overflow-x-auto">
        <table className="data-table" aria-label="Users">
          <thead>
            <tr>
              <th>Name</th>
              <th>Roles</th>
              <th>State</th>
              <th>Last sign-in</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {rows.map((u) => (
              <tr key={u.id}>
                <td>
                  <span className="font-medium">{u.name}</span>
                  <span className="block text-xs text-ink-soft">{u.email}</span>
                </td>
                <td>
                  <RolesForm userId={u.id} version={u.version} roles={u.roles} name={u.name} />
                </td>
                <td>
                  <StateTag>{u.active ? (u.lockedUntil && u.lockedUntil > new Date().toISOString() ? "locked" : "active") : "deactivated"}</StateTag>
                </td>
                <td className="figure text-xs text-ink-soft">{u.lastSignInAt?.slice(0, 16).replace("T", " ") ?? "never"}</td>
                <td>
                  <ActiveForm userId={u.id} version={u.version} active={u.active} name={u.name} />
                  {u.active ? <SetPasswordForm userId={u.id} version={u.version} name={u.name} /> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <h2 className="field-label mb-2">Invite a user</h2>
      <p className="mb-2 max-w-prose text-sm text-ink-soft">They get an e-mail with a link to choose their own password; the link works once, for 72 hours.</p>
      <div className="mb-6">
        <InviteUserForm />
      </div>
      <h2 className="field-label mb-2">Add a user with a first password</h2>
      <p className="mb-2 max-w-prose text-sm text-ink-soft">For someone without e-mail at hand: hand them the password in person; they choose their own at first sign-in.</p>
      <AddUserForm />
    </>
  );
}
