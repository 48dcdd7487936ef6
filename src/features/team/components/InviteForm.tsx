import { useState, type FormEvent } from "react";
import {
  canAssignRole,
  ROLE_DESCRIPTIONS,
  ROLE_LABELS,
  ROLES,
  type Role,
} from "../../../../shared/roles";
import { inviteBody } from "../../../../shared/schemas/team";
import { Button } from "../../../components/Button";
import { ChoiceGroup } from "../../../components/ChoiceGroup";
import { FormError, Notice } from "../../../components/FormError";
import { TextField } from "../../../components/TextField";
import { useSchemaForm } from "../../../lib/form";
import { useCreateInvitation } from "../api/create-invitation";

export function InviteForm({ teamId, actorRole }: { teamId: string; actorRole: Role }) {
  const invite = useCreateInvitation(teamId);
  const form = useSchemaForm(inviteBody, invite.error, ["email", "role"]);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const choices = ROLES.filter((r) => canAssignRole(actorRole, r)).map((r) => ({
    value: r,
    label: ROLE_LABELS[r],
    description: ROLE_DESCRIPTIONS[r],
  }));

  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const target = event.currentTarget;
    const body = form.parse(target);
    setSentTo(null);
    if (!body) return invite.reset();
    invite.mutate(body, {
      onSuccess: () => {
        setSentTo(body.email);
        target.reset();
      },
    });
  }

  return (
    <form noValidate onSubmit={onSubmit} className="space-y-4" aria-label="Invite someone">
      <TextField
        label="E-mail address"
        name="email"
        type="email"
        autoComplete="off"
        error={form.errors.email}
      />
      <ChoiceGroup
        legend="Role"
        name="role"
        choices={choices}
        defaultValue="engineer"
        error={form.errors.role}
      />
      <FormError message={form.formMessage} />
      {sentTo && <Notice>Invitation sent to {sentTo}. The link works for 7 days.</Notice>}
      <Button type="submit" pending={invite.isPending}>
        Send invitation
      </Button>
    </form>
  );
}
