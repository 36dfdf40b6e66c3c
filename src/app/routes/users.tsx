import { useStaffUser } from "../RequireAction.tsx";
import { useUsers } from "../../features/users/api/users.ts";
import { UsersTable } from "../../features/users/components/UsersTable.tsx";
import { AddUserForm } from "../../features/users/components/AddUserForm.tsx";
import { InviteForm } from "../../features/accounts/InviteForm.tsx";
import { PageHeader, Panel } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";

/** Guarded by its action in app/router.tsx. */
export default function UsersPage() {
  const me = useStaffUser();
  const users = useUsers();
  return (
    <>
      <PageHeader title="Staff" lead="Who can sign in, and what each person's role lets them do. Deactivating someone signs them out at once." />
      <div className="flex flex-col gap-8">
        {users.isPending ? <Loading /> : users.isError ? <Notice tone="danger" title={users.error.message} /> : <UsersTable users={users.data.users} selfId={me.id} />}
        <Panel title="Invite by e-mail">
          <p className="mb-3 text-sm text-ink-soft">The person chooses their own password from a single-use link. Nobody else ever knows it.</p>
          <InviteForm />
        </Panel>
        <Panel title="Add a staff member with a first password">
          <AddUserForm />
        </Panel>
      </div>
    </>
  );
}
