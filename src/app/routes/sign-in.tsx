import { Link, Navigate, useNavigate, useSearchParams } from "react-router";
import { useSession, useSignIn } from "../../lib/auth.ts";
import { TextField } from "../../components/form/Field.tsx";
import { onSubmitOf, setServerErrors, topError, useZodForm } from "../../components/form/use-zod-form.ts";
import { Button } from "../../components/ui/Button.tsx";
import { Notice } from "../../components/feedback/Notice.tsx";
import { Wordmark } from "../../components/ui/Page.tsx";
import { signInSchema } from "../../../shared/schemas/auth.ts";

/** Only same-site paths under /app are followed after sign-in, never an outside address. */
const safeNext = (next: string | null) => (next && next.startsWith("/app") && !next.startsWith("//") ? next : "/app");

export default function SignIn() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const session = useSession();
  const signIn = useSignIn();
  const form = useZodForm(signInSchema, { defaultValues: { email: "", password: "" } });
  const { errors } = form.formState;
  const next = safeNext(params.get("next"));

  if (session.data?.user) return <Navigate to={next} replace />;

  const error = signIn.error;
  const problem = topError(error);

  const submit = form.handleSubmit((values) =>
    signIn.mutate(values, { onSuccess: () => void navigate(next, { replace: true }), onError: (e) => setServerErrors(form, e) }),
  );

  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center px-5 py-10">
      <Wordmark className="text-2xl" />
      <h1 className="mt-8 text-3xl font-bold">Staff sign-in</h1>
      <p className="mt-2 text-ink-soft">For the dealership's team. Buyers don't need an account.</p>
      <form onSubmit={onSubmitOf(submit)} noValidate className="mt-8 flex flex-col gap-5" aria-describedby={error ? "sign-in-error" : undefined}>
        {problem ? (
          <div id="sign-in-error">
            <Notice tone="danger" title={problem.message} />
          </div>
        ) : null}
        <TextField
          label="E-mail"
          type="email"
          autoComplete="username"
          inputMode="email"
          required
          {...form.register("email")}
          error={errors.email?.message}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          required
          {...form.register("password")}
          error={errors.password?.message}
        />
        <Button type="submit" busy={signIn.isPending} className="mt-2 w-full">
          Sign in
        </Button>
      </form>
      <p className="mt-8 text-sm text-ink-soft"><Link to="/forgot-password">Forgotten your password?</Link> We will e-mail you a link to choose a new one.</p>
    </main>
  );
}
