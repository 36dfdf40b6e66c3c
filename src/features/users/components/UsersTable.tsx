import { useState } from "react";
import { useUpdateUser } from "../api/users.ts";
import type { UserView } from "../../../../shared/schemas/users.ts";
import { ROLES, ROLE_LABELS, type Role } from "../../../../shared/constants/roles.ts";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { DataTable, type Column } from "../../../components/ui/DataTable.tsx";

const COLUMNS: Column[] = [
  { label: "Name" },
  { label: "E-mail" },
  { label: "Role" },
  { label: "Status" },
  { label: "Last sign-in" },
  { label: "Actions", hidden: true },
];

const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" }) : "Never");

export function UsersTable({ users, selfId }: { users: UserView[]; selfId: string }) {
  const update = useUpdateUser();
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);

  function change(user: UserView, input: { role?: Role; active?: boolean }, done: string) {
    if (input.active === false && !confirm(`Deactivate ${user.name}? They are signed out everywhere at once.`)) return;
    setMessage(null);
    update.mutate(
      { id: user.id, version: user.version, ...input },
      {
        onSuccess: () => setMessage({ tone: "success", text: done }),
        onError: (e) => setMessage({ tone: "danger", text: e.message }),
      },
    );
  }

  return (
    <div className="flex flex-col gap-4">
      {message ? <Notice tone={message.tone} title={message.text} /> : null}
      <DataTable caption="Staff accounts" columns={COLUMNS}>
        {users.map((u) => (
          <tr key={u.id} className="border-b border-line last:border-0">
            <th scope="row" className="px-4 py-3 font-bold">
              {u.name}
              {u.id === selfId ? <span className="ml-2 text-xs font-normal text-ink-soft">(you)</span> : null}
            </th>
            <td className="px-4 py-3 font-mono">{u.email}</td>
            <td className="px-4 py-3">
              <label className="sr-only" htmlFor={`role-${u.id}`}>Role of {u.name}</label>
              <select
                id={`role-${u.id}`}
                className="min-h-11 rounded-md border border-line-strong bg-paper-raised px-2"
                value={u.role}
                disabled={update.isPending}
                onChange={(e) => change(u, { role: e.target.value as Role }, `${u.name} is now ${ROLE_LABELS[e.target.value as Role].label.toLowerCase()}.`)}
              >
                {ROLES.map((r) => (
                  <option key={r} value={r}>{ROLE_LABELS[r].label}</option>
                ))}
              </select>
            </td>
            <td className="px-4 py-3">{u.active ? "Active" : <span className="font-bold text-brick">Deactivated</span>}</td>
            <td className="px-4 py-3 figures text-ink-soft">{when(u.lastSignInAt)}</td>
            <td className="px-4 py-3 text-right">
              {u.id === selfId ? null : (
                <button
                  type="button"
                  className={`min-h-11 rounded-md px-3 font-bold ${u.active ? "text-brick hover:bg-brick-wash" : "text-signal hover:bg-signal-wash"}`}
                  disabled={update.isPending}
                  onClick={() => change(u, { active: !u.active }, u.active ? `${u.name} is deactivated and signed out.` : `${u.name} can sign in again.`)}
                >
                  {u.active ? "Deactivate" : "Reactivate"}
                </button>
              )}
            </td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}
