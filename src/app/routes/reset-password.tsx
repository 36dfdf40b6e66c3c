import { Link, useSearchParams } from "react-router";
import { useConfirmReset } from "../../features/accounts/api/accounts.ts";
import { PublicFrame } from "../../features/accounts/PublicFrame.tsx";
import { NewPasswordForm } from "../../features/accounts/NewPasswordForm.tsx";
import { isApiError } from "../../lib/api-client.ts";
import { Notice } from "../../components/feedback/Notice.tsx";

export default function ResetPassword() {
  const [params] = useSearchParams();
  const token = params.get("token") ?? "";
  const confirm = useConfirmReset();
  const error = confirm.error;
  const invalid = isApiError(error) && error.code === "invalid_token";

  if (!token || token.length < 20 || invalid)
    return (
      <PublicFrame title="This link is no longer valid">
        <Notice tone="caution" title="The reset link cannot be used">
          {invalid ? error.message : "The link is incomplete. Open it again from the e-mail, or ask for a new one."} A reset link works once, within an hour of asking.
        </Notice>
        <p className="mt-6">
          <Link to="/forgot-password" className="font-bold">Ask for a new link</Link>
        </p>
      </PublicFrame>
    );

  if (confirm.isSuccess)
    return (
      <PublicFrame title="Password changed">
        <Notice tone="success" title="Your new password is set">
          For safety we signed your account out everywhere else: on any other computer or phone, sign in again with the new password.
        </Notice>
        <p className="mt-6">
          <Link to="/sign-in" className="font-bold">Password changed; sign in</Link>
        </p>
      </PublicFrame>
    );

  return (
    <PublicFrame title="Choose a new password" lead="Type it twice. Once it is saved, every other sign-in of your account ends.">
      <NewPasswordForm
        submitLabel="Save the new password"
        busy={confirm.isPending}
        error={error}
        serverError={error && !Object.keys(isApiError(error) ? error.fields : {}).length ? error.message : undefined}
        onSubmit={(password) => confirm.mutate({ token, password })}
      />
    </PublicFrame>
  );
}
