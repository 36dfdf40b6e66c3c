import type { ReactNode } from "react";
import { useOutletContext } from "react-router";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { can, type Action } from "../../shared/permissions.ts";
import { Notice } from "../components/feedback/Notice.tsx";

export const useStaffUser = () => useOutletContext<SessionUser>();

/** Shows a screen only to roles that may take its action (shared/permissions.ts); the server refuses the rest anyway. */
export function RequireAction({ action, children }: { action: Action; children: ReactNode }) {
  const user = useStaffUser();
  if (!can(user, action))
    return (
      <Notice tone="info" title="Your role does not include this screen">
        Ask an admin if you need it.
      </Notice>
    );
  return <>{children}</>;
}
