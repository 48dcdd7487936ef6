import { type FormEvent } from "react";
import { Link, useParams } from "react-router-dom";
import { z } from "zod";
import { passwordSchema } from "../../../../shared/schemas/common";
import { AuthCard } from "../../../components/AuthFrame";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { linkClass } from "../../../components/link-styles";
import { TextField } from "../../../components/TextField";
import { isApiError } from "../../../lib/api";
import { useSchemaForm } from "../../../lib/form";
import { useCompletePasswordReset } from "../api/reset-complete";

const newPasswordForm = z
  .object({ password: passwordSchema, confirmPassword: z.string() })
  .refine((v) => v.password === v.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two passwords differ.",
  });

export function ResetCompletePage() {
  const { token = "" } = useParams();
  const complete = useCompletePasswordReset();
  const form = useSchemaForm(newPasswordForm, complete.error, ["password", "confirmPassword"]);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return complete.reset();
    complete.mutate({ token, password: body.password });
  }

  if (complete.isSuccess) {
    return (
      <AuthCard title="Password changed">
        <Notice>
          Your new password is set. Every device that was signed in to this account has been signed
          out.
        </Notice>
        <p className="mt-4 text-sm">
          <Link to="/sign-in" className={linkClass}>
            Sign in with the new password
          </Link>
        </p>
      </AuthCard>
    );
  }

  const expired = isApiError(complete.error, 410);
  return (
    <AuthCard title="Choose a new password">
      <form noValidate onSubmit={onSubmit} className="space-y-4">
        <TextField
          label="New password"
          name="password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          error={form.errors.password}
          autoFocus
        />
        <TextField
          label="New password, again"
          name="confirmPassword"
          type="password"
          autoComplete="new-password"
          error={form.errors.confirmPassword}
        />
        <FormError
          message={
            expired
              ? "This reset link has expired or was already used. Ask for a new one below."
              : form.formMessage
          }
        />
        <Button type="submit" pending={complete.isPending} className="w-full">
          Set new password
        </Button>
      </form>
      <p className="mt-6 border-t border-ink-100 pt-4 text-center text-sm">
        <Link to="/reset-password" className={linkClass}>
          Ask for a new reset link
        </Link>
      </p>
    </AuthCard>
  );
}
