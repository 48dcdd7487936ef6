import { useState, type FormEvent } from "react";
import { Link } from "react-router-dom";
import { resetRequestBody } from "../../../../shared/schemas/auth";
import { AuthCard } from "../../../components/AuthFrame";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { linkClass } from "../../../components/link-styles";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { useRequestPasswordReset } from "../api/reset-request";
import { LocalMailNote } from "./LocalMailNote";

export function ResetRequestPage() {
  const request = useRequestPasswordReset();
  const form = useSchemaForm(resetRequestBody, request.error, ["email"]);
  const [sentTo, setSentTo] = useState<string | null>(null);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return request.reset();
    request.mutate(body, { onSuccess: () => setSentTo(body.email) });
  }

  return (
    <AuthCard
      title="Reset your password"
      intro="We'll e-mail you a link to choose a new password. It works once, within one hour."
    >
      {sentTo ? (
        <>
          <Notice>
            If <strong>{sentTo}</strong> has a Rillmark account, the reset link is on its way.
          </Notice>
          <LocalMailNote />
        </>
      ) : (
        <form noValidate onSubmit={onSubmit} className="space-y-4">
          <TextField
            label="E-mail"
            name="email"
            type="email"
            autoComplete="username"
            error={form.errors.email}
            autoFocus
          />
          <FormError message={form.formMessage} />
          <Button type="submit" pending={request.isPending} className="w-full">
            E-mail me a reset link
          </Button>
        </form>
      )}
      <p className="mt-6 border-t border-ink-100 pt-4 text-center text-sm">
        <Link to="/sign-in" className={linkClass}>
          Back to sign-in
        </Link>
      </p>
    </AuthCard>
  );
}
