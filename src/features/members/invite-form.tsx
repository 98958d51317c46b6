import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { inviteSchema, type InviteInput } from "../../../shared/auth/schemas.ts";
import { ROLE_LABELS, ROLES_BY_KIND, type OrganisationKind } from "../../../shared/auth/roles.ts";
import { useInvite } from "./api/members.ts";
import { TextField, SelectField } from "../../components/ui/field.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { applyServerErrors } from "../../lib/form-errors.ts";

export function InviteForm({ orgId, kind }: { orgId: number; kind: OrganisationKind }) {
  const invite = useInvite(orgId);
  const [message, setMessage] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const roles = ROLES_BY_KIND[kind];
  const { register, handleSubmit, setError, reset, formState } = useForm<InviteInput>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { email: "", role: roles[0] },
  });

  const onSubmit = handleSubmit((values) => {
    setMessage(null);
    invite.mutate(values, {
      onSuccess: (inv) => {
        setMessage({ tone: "success", text: `Invitation sent to ${inv.email}.` });
        reset({ email: "", role: values.role });
      },
      onError: (err) => {
        const rest = applyServerErrors(err, setError, ["email", "role"]);
        if (rest) setMessage({ tone: "error", text: rest });
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {message && <Notice tone={message.tone}>{message.text}</Notice>}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr_auto] sm:items-start">
        <TextField label="E-mail address" type="email" error={formState.errors.email?.message} {...register("email")} />
        <SelectField
          label="Role"
          error={formState.errors.role?.message}
          options={roles.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
          {...register("role")}
        />
        <Button type="submit" className="sm:mt-7" disabled={invite.isPending}>
          {invite.isPending ? "Sending…" : "Send invitation"}
        </Button>
      </div>
    </form>
  );
}
