import { useState, type FormEvent } from "react";
import { useCreateUser } from "../api/users.ts";
import { isApiError } from "../../../lib/api-client.ts";
import { SelectField, TextField } from "../../../components/form/Field.tsx";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { ROLES, ROLE_LABELS, type Role } from "../../../../shared/constants/roles.ts";

const empty = { email: "", name: "", role: "sales" as Role, password: "" };

export function AddUserForm() {
  const create = useCreateUser();
  const [form, setForm] = useState(empty);
  const [added, setAdded] = useState<string | null>(null);
  const fields = isApiError(create.error) ? create.error.fields : {};
  const set = (key: keyof typeof empty) => (e: { target: { value: string } }) => setForm({ ...form, [key]: e.target.value });

  function submit(e: FormEvent) {
    e.preventDefault();
    setAdded(null);
    create.mutate(form, {
      onSuccess: ({ user }) => {
        setAdded(`${user.name} can now sign in as ${ROLE_LABELS[user.role].label.toLowerCase()} with the password you set. Ask them to keep it private.`);
        setForm(empty);
      },
    });
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 sm:grid-cols-2" aria-label="Add a staff member">
      {added ? (
        <div className="sm:col-span-2">
          <Notice tone="success" title="Added">
            {added}
          </Notice>
        </div>
      ) : null}
      {create.error && !Object.keys(fields).length ? (
        <div className="sm:col-span-2">
          <Notice tone="danger" title={create.error.message} />
        </div>
      ) : null}
      <TextField label="Name" name="name" value={form.name} onChange={set("name")} error={fields.name} autoComplete="off" />
      <TextField label="E-mail" name="email" type="email" value={form.email} onChange={set("email")} error={fields.email} autoComplete="off" />
      <SelectField label="Role" name="role" value={form.role} onChange={set("role")} error={fields.role} hint={ROLE_LABELS[form.role].summary}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r].label}
          </option>
        ))}
      </SelectField>
      <TextField
        label="First password"
        name="password"
        type="password"
        autoComplete="new-password"
        value={form.password}
        onChange={set("password")}
        error={fields.password}
        hint="At least 12 characters. Common passwords are refused."
      />
      <div className="sm:col-span-2">
        <Button type="submit" busy={create.isPending}>
          Add staff member
        </Button>
      </div>
    </form>
  );
}
