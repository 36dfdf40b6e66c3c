import { useState } from "react";
import { useCreateUser } from "../api/users.ts";
import { SelectField, TextField } from "../../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, topError, useZodForm } from "../../../components/form/use-zod-form.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { ROLES, ROLE_LABELS, type Role } from "../../../../shared/constants/roles.ts";
import { createUserSchema } from "../../../../shared/schemas/users.ts";

const empty = { email: "", name: "", role: "sales" as Role, password: "" };

export function AddUserForm() {
  const create = useCreateUser();
  const form = useZodForm(createUserSchema, { defaultValues: empty });
  const { errors } = form.formState;
  const [added, setAdded] = useState<string | null>(null);
  const problem = topError(create.error);
  const role = form.watch("role");

  const submit = form.handleSubmit(
    (values) => {
      setAdded(null);
      create.mutate(values, {
        onSuccess: ({ user }) => {
          setAdded(`${user.name} can now sign in as ${ROLE_LABELS[user.role].label.toLowerCase()} with the password you set. Ask them to keep it private.`);
          form.reset(empty);
        },
        onError: (e) => setServerErrors(form, e),
      });
    },
    () => setAdded(null),
  );

  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="grid gap-4 sm:grid-cols-2" aria-label="Add a staff member">
      {added ? (
        <div className="sm:col-span-2">
          <Notice tone="success" title="Added">
            {added}
          </Notice>
        </div>
      ) : null}
      {problem ? (
        <div className="sm:col-span-2">
          <Notice tone="danger" title={problem.message} />
        </div>
      ) : null}
      <TextField label="Name" {...form.register("name")} error={errors.name?.message} autoComplete="off" />
      <TextField label="E-mail" type="email" {...form.register("email")} error={errors.email?.message} autoComplete="off" />
      <SelectField label="Role" {...form.register("role")} error={errors.role?.message} hint={ROLE_LABELS[role].summary}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r].label}
          </option>
        ))}
      </SelectField>
      <TextField
        label="First password"
        type="password"
        autoComplete="new-password"
        {...form.register("password")}
        error={errors.password?.message}
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
