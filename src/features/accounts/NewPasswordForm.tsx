import { useEffect, type ReactNode } from "react";
import { z } from "zod";
import { TextField } from "../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, useZodForm } from "../../components/form/use-zod-form.ts";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { tokenPasswordSchema } from "../../../shared/schemas/enquiries.ts";

/** The server's password rule, and the second copy checked here only (the server never sees it). */
const newPasswordForm = tokenPasswordSchema
  .pick({ password: true })
  .extend({ again: z.string() })
  .superRefine(
    (v, ctx) => {
      if (!v.password) return;
      if (!v.again) ctx.addIssue({ code: "custom", path: ["again"], message: "Type the password again." });
      else if (v.again !== v.password) ctx.addIssue({ code: "custom", path: ["again"], message: "The two passwords are not the same." });
    },
    // Also when the password itself is refused, so both problems show at once.
    { when: (payload) => typeof payload.value === "object" && payload.value !== null },
  );

/**
 * A new password typed twice, checked here with the server's own rule (at least 12 characters) before it is sent.
 * The server also refuses common passwords; its message lands under the first field.
 */
export function NewPasswordForm({
  submitLabel,
  busy,
  error,
  serverError,
  username,
  onSubmit,
}: {
  submitLabel: string;
  busy: boolean;
  /** The mutation's error: its `fields` land on the inputs. */
  error: unknown;
  serverError?: ReactNode;
  /** For password managers: the account the password belongs to. */
  username?: string;
  onSubmit: (password: string) => void;
}) {
  const form = useZodForm(newPasswordForm, { defaultValues: { password: "", again: "" } });
  const { errors } = form.formState;

  // The server's answer (a common password, say) lands under the field it names; what was typed stays.
  useEffect(() => setServerErrors(form, error), [error, form]);

  const submit = form.handleSubmit(({ password }) => onSubmit(password));

  return (
    <form onSubmit={onSubmitOf(submit)} noValidate className="flex flex-col gap-5">
      {serverError ? <Notice tone="danger" title={serverError} /> : null}
      {username ? <input type="text" name="username" autoComplete="username" value={username} readOnly hidden /> : null}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        {...form.register("password")}
        error={errors.password?.message}
        hint="At least 12 characters. A few unrelated words make a strong password you can remember."
      />
      <TextField label="The same password again" type="password" autoComplete="new-password" {...form.register("again")} error={errors.again?.message} />
      <Button type="submit" busy={busy} className="mt-2 w-full">
        {submitLabel}
      </Button>
    </form>
  );
}
