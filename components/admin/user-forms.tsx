"use client";

import { useActionState } from "react";
import { addUserAction, inviteUserAction, setActiveAction, setPasswordAction, setRolesAction } from "@/app/(app)/admin/users/actions";
import type { ActionResult } from "@/lib/auth/action";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/auth/roles";

function ResultLine({ state }: { state: ActionResult<unknown> | null }) {
  if (!state) return null;
  if (state.ok) return <p role="status" className="text-xs text-ok">{state.message}</p>;
  return (
    <div role="alert" className="text-xs text-signal">
      <p>{state.error}</p>
      {state.issues.length ? (
        <ul className="list-inside list-disc">
          {state.issues.map((i) => (
            <li key={i.path + i.message}>
              {i.path}: {i.message}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function RoleBoxes() {
  return (
    <fieldset>
      <legend className="field-label">Roles</legend>
      <div className="mt-1 flex flex-wrap gap-3 text-sm">
        {ROLES.map((role) => (
          <label key={role} className="inline-flex items-center gap-1">
            <input type="checkbox" name={`role-${role}`} /> {ROLE_LABELS[role]}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** The usual way in: the person chooses their own first password from an e-mailed link. */
export function InviteUserForm() {
  const [state, action, pending] = useActionState(inviteUserAction, null);
  return (
    <form action={action} className="sheet grid gap-3 p-4 sm:grid-cols-2" aria-label="Invite a user">
      <div>
        <label htmlFor="invite-name" className="field-label">Name</label>
        <input id="invite-name" name="name" className="input mt-1" required />
      </div>
      <div>
        <label htmlFor="invite-email" className="field-label">E-mail</label>
        <input id="invite-email" name="email" type="email" className="input mt-1" required />
      </div>
      <RoleBoxes />
      <div className="flex items-center gap-3 sm:col-span-2">
        <button className="btn" type="submit" disabled={pending}>
          {pending ? "Sending…" : "Send invitation"}
        </button>
        <ResultLine state={state} />
      </div>
    </form>
  );
}

/** For a person who forgot their password and cannot receive e-mail: they replace this one at their next sign-in. */
export function SetPasswordForm({ userId, version, name }: { userId: string; version: number; name: string }) {
  const [state, action, pending] = useActionState(setPasswordAction, null);
  return (
    <details className="text-sm">
      <summary className="cursor-pointer text-ink-soft">Set a password</summary>
      <form action={action} aria-label={`Set a password for ${name}`} className="mt-2 flex flex-wrap items-center gap-2">
        <input type="hidden" name="userId" value={userId} />
        <input type="hidden" name="version" value={version} />
        <input id={`set-password-${userId}`} aria-label={`New password for ${name} (12+ characters)`} name="password" type="text" minLength={12} className="input w-48" autoComplete="off" required placeholder="12+ characters" />
        <button className="btn-quiet" type="submit" disabled={pending}>
          Set password
        </button>
        <ResultLine state={state} />
      </form>
    </details>
  );
}

export function AddUserForm() {
  const [state, action, pending] = useActionState(addUserAction, null);
  return (
    <form action={action} className="sheet grid gap-3 p-4 sm:grid-cols-2" aria-label="Add a user">
      <div>
        <label htmlFor="new-name" className="field-label">Name</label>
        <input id="new-name" name="name" className="input mt-1" required />
      </div>
      <div>
        <label htmlFor="new-email" className="field-label">E-mail</label>
        <input id="new-email" name="email" type="email" className="input mt-1" required />
      </div>
      <div>
        <label htmlFor="new-password" className="field-label">First password (12+ characters)</label>
        <input id="new-password" name="password" type="text" minLength={12} className="input mt-1" required autoComplete="off" />
      </div>
      <RoleBoxes />
      <div className="flex items-center gap-3 sm:col-span-2">
        <button className="btn" type="submit" disabled={pending}>
          {pending ? "Adding…" : "Add user"}
        </button>
        <ResultLine state={state} />
      </div>
    </form>
  );
}

export function RolesForm({ userId, version, roles, name }: { userId: string; version: number; roles: Role[]; name: string }) {
  const [state, action, pending] = useActionState(setRolesAction, null);
  return (
    <form action={action} className="flex flex-wrap items-center gap-3 text-sm" aria-label={`Roles of ${name}`}>
      <input type="hidden" name="userId" value={userId} />
      <input type="hidden" name="version" value={version} />
      {ROLES.map((role) => (
        <label key={role} className="inline-flex items-center gap-1">
          <input type="checkbox" name={`role-${role}`} defaultChecked={roles.includes(role)} /> {ROLE_LABELS[role]}
        </label>
      ))}
      <button className="btn-quiet" type="submit" disabled={pending}>
        Save roles
      </button>
      <ResultLine state={state} />
    </form>
  );
}

export function ActiveForm({ userId, version, active, name }: { userId: string; version: number; active: boolean; name: string }) {
  const [state, action, pending] = useActionState(setActiveAction, null);
  return (
    <form action={action} aria-label={`${active ? "Deactivate" : "Reactivate"} ${name}`}>
      <input type="hidden" name="userId" value={userId} />
      <input type="hidden" name="version" value={version} />
      <input type="hidden" name="active" value={active ? "false" : "true"} />
      <button className="btn-quiet" type="submit" disabled={pending}>
        {active ? "Deactivate" : "Reactivate"}
      </button>
      <ResultLine state={state} />
    </form>
  );
}
