import { Link, useNavigate, useSearchParams } from "react-router";
import { useAcceptInvite, useInvitation } from "../../features/accounts/api/accounts.ts";
import { PublicFrame } from "../../features/accounts/PublicFrame.tsx";
import { NewPasswordForm } from "../../features/accounts/NewPasswordForm.tsx";
import { isApiError } from "../../lib/api-client.ts";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";
import { ROLE_LABELS } from "../../../shared/constants/roles.ts";

function NoLonger({ message }: { message?: string }) {
  return (
    <PublicFrame title="This link is no longer valid">
      <Notice tone="caution" title="The invitation cannot be used">
        {message ?? "The link is incomplete. Open it again from the e-mail."} An invitation works once and expires after 7 days; ask the admin who invited you to send a new one.
      </Notice>
      <p className="mt-6 text-sm text-ink-soft">
        Already have an account? <Link to="/sign-in">Sign in</Link>
      </p>
    </PublicFrame>
  );
}

export default function AcceptInvite() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const token = params.get("token") ?? "";
  const invitation = useInvitation(token);
  const accept = useAcceptInvite();

  if (!token) return <NoLonger />;
  if (invitation.isPending) return <Loading label="Checking your invitation…" />;
  if (invitation.isError) return <NoLonger message={invitation.error.status === 400 ? invitation.error.message : `The invitation could not be checked: ${invitation.error.message}`} />;
  const error = accept.error;
  if (isApiError(error) && error.code === "invalid_token") return <NoLonger message={error.message} />;

  const inv = invitation.data.invitation;
  const role = inv.role ? ROLE_LABELS[inv.role] : null;
  const fields = isApiError(error) ? error.fields : {};
  return (
    <PublicFrame title={`Welcome${inv.name ? `, ${inv.name}` : ""}`} lead="Choose the password you will sign in with. Only you will know it.">
      <dl className="mb-6 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 rounded-lg border border-line bg-paper-raised px-4 py-3 text-sm">
        <dt className="text-ink-soft">E-mail</dt>
        <dd className="font-mono break-all">{inv.email}</dd>
        <dt className="text-ink-soft">Role</dt>
        <dd>
          <span className="font-bold">{role?.label ?? "Staff"}</span>
          {role ? <span className="block text-ink-soft">{role.summary}</span> : null}
        </dd>
      </dl>
      <NewPasswordForm
        username={inv.email}
        submitLabel="Create my account"
        busy={accept.isPending}
        error={error}
        serverError={error && !Object.keys(fields).length ? error.message : undefined}
        onSubmit={(password) => accept.mutate({ token, password }, { onSuccess: () => void navigate("/app", { replace: true }) })}
      />
    </PublicFrame>
  );
}
