import { type FormEvent } from "react";
import { updateAccountBody, type SessionInfo } from "../../../../shared/schemas/auth";
import { Button } from "../../../components/Button";
import { FormError, Notice } from "../../../components/FormError";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { useUpdateAccount } from "../api/update-account";

export function ProfileForm({ account }: { account: SessionInfo }) {
  const update = useUpdateAccount();
  const form = useSchemaForm(updateAccountBody, update.error, ["name"]);

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const body = form.parse(event.currentTarget);
    if (!body) return update.reset();
    update.mutate(body);
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4">
      <TextField
        label="E-mail"
        name="email"
        value={account.user.email}
        readOnly
        disabled
        hint="Your sign-in address. It cannot be changed here."
      />
      <TextField
        label="Name"
        name="name"
        autoComplete="name"
        defaultValue={account.user.name}
        hint="Shown to your team on members lists, comments and sign-offs."
        error={form.errors.name}
      />
      <FormError message={form.formMessage} />
      {update.isSuccess && <Notice>Name saved.</Notice>}
      <Button type="submit" pending={update.isPending}>
        Save name
      </Button>
    </form>
  );
}
