import { type FormEvent } from "react";
import { z } from "zod";
import { passwordSchema, personNameSchema } from "../../../../shared/schemas/common";
import { type SessionInfo } from "../../../../shared/schemas/auth";
import { Button } from "../../../components/Button";
import { FormError } from "../../../components/FormError";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { useAcceptInvitation } from "../api/accept-invitation";

/** The accept body with both fields required, plus a typed-twice check on the password. */
const newAccountForm = z
  .object({ name: personNameSchema, password: passwordSchema, confirmPassword: z.string() })
  .refine((v) => v.password === v.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two passwords differ.",
  });

interface NewAccountFormProps {
  token: string;
  email: string;
  teamName: string;
  onJoined: (session: SessionInfo) => void;
}

export function NewAccountForm({ token, email, teamName, onJoined }: NewAccountFormProps) {
  const accept = useAcceptInvitation(token);
  const form = useSchemaForm(newAccountForm, accept.error, ["name", "password", "confirmPassword"]);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return accept.reset();
    accept.mutate({ name: body.name, password: body.password }, { onSuccess: onJoined });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4">
      <TextField label="E-mail" name="email" value={email} readOnly disabled />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        error={form.errors.name}
        autoFocus
      />
      <TextField
        label="Choose a password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={form.errors.password}
      />
      <TextField
        label="Password, again"
        name="confirmPassword"
        type="password"
        autoComplete="new-password"
        error={form.errors.confirmPassword}
      />
      <FormError message={form.formMessage} />
      <Button type="submit" pending={accept.isPending} className="w-full">
        Create account and join {teamName}
      </Button>
    </form>
  );
}
