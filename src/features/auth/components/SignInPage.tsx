import { type FormEvent } from "react";
import { Link, Navigate, useNavigate, useSearchParams } from "react-router-dom";
import { signInBody } from "../../../../shared/schemas/auth";
import { AuthCard } from "../../../components/AuthFrame";
import { Button } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { linkClass } from "../../../components/link-styles";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { safeNext } from "../../../lib/navigation";
import { usePublicConfig, useSession } from "../../../lib/session";
import { useSignIn } from "../api/sign-in";

export function SignInPage() {
  const config = usePublicConfig();
  const session = useSession();
  const [params] = useSearchParams();
  const next = safeNext(params.get("next"));
  const navigate = useNavigate();
  const signIn = useSignIn();
  const form = useSchemaForm(signInBody, signIn.error, ["email", "password"]);

  if (session && !signIn.isPending && !signIn.isSuccess) return <Navigate to={next} replace />;

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return signIn.reset();
    signIn.mutate(body, { onSuccess: () => navigate(next, { replace: true }) });
  }

  return (
    <AuthCard
      title="Sign in to Rillmark"
      intro="Use the e-mail address your team invited, or the one you signed up with."
    >
      <form noValidate onSubmit={onSubmit} className="space-y-4">
        <TextField
          label="E-mail"
          name="email"
          type="email"
          autoComplete="username"
          defaultValue={params.get("email") ?? ""}
          error={form.errors.email}
          autoFocus
        />
        <div>
          <TextField
            label="Password"
            name="password"
            type="password"
            autoComplete="current-password"
            error={form.errors.password}
          />
          <p className="mt-1.5 text-right text-sm">
            <Link to="/reset-password" className={linkClass}>
              Forgot your password?
            </Link>
          </p>
        </div>
        <FormError message={form.formMessage} />
        <Button type="submit" pending={signIn.isPending} className="w-full">
          Sign in
        </Button>
      </form>
      {config.signUpEnabled && (
        <p className="mt-6 border-t border-ink-100 pt-4 text-center text-sm text-ink-600">
          New to Rillmark?{" "}
          <Link to="/sign-up" className={linkClass}>
            Create an account and a team
          </Link>
        </p>
      )}
    </AuthCard>
  );
}
