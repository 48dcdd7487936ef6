import { useState, type FormEvent } from "react";
import { Link } from "react-router-dom";
import { signUpBody } from "../../../../shared/schemas/auth";
import { AuthCard } from "../../../components/AuthFrame";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { linkClass } from "../../../components/link-styles";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { usePublicConfig } from "../../../lib/session";
import { useSignUp } from "../api/sign-up";
import { LocalMailNote } from "./LocalMailNote";

const FIELDS = ["email", "name", "password", "teamName"] as const;

export function SignUpPage() {
  const config = usePublicConfig();
  const signUp = useSignUp();
  const form = useSchemaForm(signUpBody, signUp.error, FIELDS);
  const [sentTo, setSentTo] = useState<string | null>(null);

  if (!config.signUpEnabled) {
    return (
      <AuthCard title="Sign-up is turned off here">
        <p className="text-sm text-ink-700">
          This Rillmark server takes new people by invitation only. Ask an admin of your team to
          invite you; the invitation e-mail has a link to set up your account.
        </p>
        <p className="mt-4 text-sm">
          <Link to="/sign-in" className={linkClass}>
            Back to sign-in
          </Link>
        </p>
      </AuthCard>
    );
  }

  if (sentTo) {
    return (
      <AuthCard title="Check your e-mail">
        <Notice>
          We sent a confirmation link to <strong>{sentTo}</strong>. Open it within 24 hours to
          create your account and your team.
        </Notice>
        <LocalMailNote />
        <p className="mt-4 text-sm text-ink-600">
          Nothing arrived? Look in the spam folder, or{" "}
          <button type="button" className={linkClass} onClick={() => setSentTo(null)}>
            use another address
          </button>
          .
        </p>
      </AuthCard>
    );
  }

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return signUp.reset();
    signUp.mutate(body, { onSuccess: () => setSentTo(body.email) });
  }

  return (
    <AuthCard
      title="Create your Rillmark team"
      intro="You become the team's owner and can invite your colleagues once you're in."
    >
      <form noValidate onSubmit={onSubmit} className="space-y-4">
        <TextField
          label="Work e-mail"
          name="email"
          type="email"
          autoComplete="email"
          error={form.errors.email}
          autoFocus
        />
        <TextField label="Your name" name="name" autoComplete="name" error={form.errors.name} />
        <TextField
          label="Password"
          name="password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters. A short sentence works well."
          error={form.errors.password}
        />
        <TextField
          label="Team name"
          name="teamName"
          autoComplete="organization"
          hint="Usually your firm or department, e.g. “Westbank Drainage Group”."
          error={form.errors.teamName}
        />
        <FormError message={form.formMessage} />
        <Button type="submit" pending={signUp.isPending} className="w-full">
          Send confirmation link
        </Button>
      </form>
      <p className="mt-6 border-t border-ink-100 pt-4 text-center text-sm text-ink-600">
        Already have an account?{" "}
        <Link to="/sign-in" className={linkClass}>
          Sign in
        </Link>
      </p>
    </AuthCard>
  );
}
