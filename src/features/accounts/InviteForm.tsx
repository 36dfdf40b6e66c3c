import { useState } from "react";
import { useInvite } from "./api/accounts.ts";
import { SelectField, TextField } from "../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, topError, useZodForm } from "../../components/form/use-zod-form.ts";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { ROLES, ROLE_LABELS, type Role } from "../../../shared/constants/roles.ts";
import { inviteSchema } from "../../../shared/schemas/enquiries.ts";

const blank = { email: "", name: "", role: "sales" as Role };

/** An admin invites a colleague by e-mail; they choose their own password from the link. */
export function InviteForm() {
  const invite = useInvite();
  const form = useZodForm(inviteSchema, { defaultValues: blank });
  const { errors } = form.formState;
  const [sent, setSent] = useState<string | null>(null);
  const problem = topError(invite.error);
  // Typing again means the last "sent" is no longer news.
  const field = (key: keyof typeof blank) => form.register(key, { onChange: () => setSent(null) });
  const role = form.watch("role");

  const submit = form.handleSubmit((values) =>
    invite.mutate(values, {
      onSuccess: ({ invited }) => {
        setSent(invited);
        form.reset(blank);
      },
      onError: (e) => setServerErrors(form, e),
    }),
  );

  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="grid gap-4 sm:grid-cols-2" aria-label="Invite a staff member">
      {sent ? (
        <div className="sm:col-span-2">
          <Notice tone="success" title="Invitation sent">
            An invitation is on its way to <span className="font-mono">{sent}</span>; the link works once and expires in 7 days.
          </Notice>
        </div>
      ) : null}
      {problem ? (
        <div className="sm:col-span-2">
          <Notice tone="danger" title="No invitation sent">{problem.message}</Notice>
        </div>
      ) : null}
      <TextField label="Name" {...field("name")} error={errors.name?.message} autoComplete="off" />
      <TextField label="E-mail" type="email" inputMode="email" {...field("email")} error={errors.email?.message} autoComplete="off" />
      <SelectField label="Role" {...field("role")} error={errors.role?.message} hint={ROLE_LABELS[role].summary}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r].label}
          </option>
        ))}
      </SelectField>
      <div className="sm:col-span-2">
        <p className="mb-3 text-sm text-ink-soft">They get an e-mail with a link to choose their own password. Nobody else ever sees it.</p>
        <Button type="submit" busy={invite.isPending}>
          Send invitation
        </Button>
      </div>
    </form>
  );
}
