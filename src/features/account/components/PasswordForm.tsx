import { type FormEvent } from "react";
import { z } from "zod";
import { changePasswordBody } from "../../../../shared/schemas/auth";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { useChangePassword } from "../api/change-password";

const passwordForm = changePasswordBody
  .extend({ confirmPassword: z.string() })
  .refine((v) => v.newPassword === v.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two new passwords differ.",
  });

const FIELDS = ["currentPassword", "newPassword", "confirmPassword"] as const;

export function PasswordForm() {
  const change = useChangePassword();
  const form = useSchemaForm(passwordForm, change.error, FIELDS);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const target = event.currentTarget;
    const body = form.parse(target);
    if (!body) return change.reset();
    change.mutate(
      { currentPassword: body.currentPassword, newPassword: body.newPassword },
      { onSuccess: () => target.reset() },
    );
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4">
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        error={form.errors.currentPassword}
      />
      <TextField
        label="New password"
        name="newPassword"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={form.errors.newPassword}
      />
      <TextField
        label="New password, again"
        name="confirmPassword"
        type="password"
        autoComplete="new-password"
        error={form.errors.confirmPassword}
      />
      <FormError message={form.formMessage} />
      {change.isSuccess && (
        <Notice>Password changed. Other devices signed in to this account were signed out.</Notice>
      )}
      <Button type="submit" pending={change.isPending}>
        Change password
      </Button>
    </form>
  );
}
