import { useState, type FormEvent } from "react";
import { useInvite } from "./api/accounts.ts";
import { isApiError } from "../../lib/api-client.ts";
import { SelectField, TextField } from "../../components/form/Field.tsx";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { ROLES, ROLE_LABELS, type Role } from "../../../shared/constants/roles.ts";
import { inviteSchema } from "../../../shared/schemas/enquiries.ts";
import { zodFields } from "../../../shared/schemas/fields.ts";

const blank = { email: "", name: "", role: "sales" as Role };

/** An admin invites a colleague by e-mail; they choose their own password from the link. */
export function InviteForm() {
  const invite = useInvite();
  const [form, setForm] = useState(blank);
  const [clientFields, setClientFields] = useState<Record<string, string>>({});
  const [sent, setSent] = useState<string | null>(null);
  const error = invite.error;
  const fields = { ...(isApiError(error) ? error.fields : {}), ...clientFields };
  const set = (key: keyof typeof blank) => (e: { target: { value: string } }) => {
    setForm({ ...form, [key]: e.target.value });
    setSent(null);
  };

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = inviteSchema.safeParse(form);
    if (!parsed.success) return setClientFields(zodFields(parsed.error));
    setClientFields({});
    invite.mutate(parsed.data, {
      onSuccess: ({ invited }) => {
        setSent(invited);
        setForm(blank);
      },
    });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 sm:grid-cols-2" aria-label="Invite a staff member">
      {sent ? (
        <div className="sm:col-span-2">
          <Notice tone="success" title="Invitation sent">
            An invitation is on its way to <span className="font-mono">{sent}</span>; the link works once and expires in 7 days.
          </Notice>
        </div>
      ) : null}
      {error && !Object.keys(fields).length ? (
        <div className="sm:col-span-2">
          <Notice tone="danger" title="No invitation sent">{error.message}</Notice>
        </div>
      ) : null}
      <TextField label="Name" name="name" value={form.name} onChange={set("name")} error={fields.name} autoComplete="off" />
      <TextField label="E-mail" name="email" type="email" inputMode="email" value={form.email} onChange={set("email")} error={fields.email} autoComplete="off" />
      <SelectField label="Role" name="role" value={form.role} onChange={set("role")} error={fields.role} hint={ROLE_LABELS[form.role].summary}>
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
