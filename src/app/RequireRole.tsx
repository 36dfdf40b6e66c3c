import type { ReactNode } from "react";
import { useOutletContext } from "react-router";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import type { Role } from "../../shared/constants/roles.ts";
import { Notice } from "../components/feedback/Notice.tsx";

export const useStaffUser = () => useOutletContext<SessionUser>();

export function RequireRole({ roles, children }: { roles: Role[]; children: ReactNode }) {
  const user = useStaffUser();
  if (!roles.includes(user.role))
    return (
      <Notice tone="info" title="Your role does not include this screen">
        Ask an admin if you need it.
      </Notice>
    );
  return <>{children}</>;
}
