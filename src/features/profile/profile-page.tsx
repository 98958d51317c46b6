import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { changePasswordSchema, profileSchema, type ChangePasswordInput, type ProfileInput } from "../../../shared/auth/schemas.ts";
import { ROLE_LABELS } from "../../../shared/auth/roles.ts";
import { api } from "../../lib/api-client.ts";
import { applyServerErrors } from "../../lib/form-errors.ts";
import { useSignedIn } from "../../lib/signed-in.tsx";
import { sessionQueryOptions } from "../../lib/session.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { TextField } from "../../components/ui/field.tsx";
import { CurrentPasswordField, NewPasswordField } from "../../components/credential-fields.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { PreferencesCard } from "./preferences-card.tsx";

export function ProfilePage() {
  const { user } = useSignedIn();
  return (
    <>
      <PageHeader title="Profile" lead="Your name as colleagues and partners see it, your password and your organisations." />
      <div className="grid gap-6 lg:grid-cols-2">
        <NameForm initialName={user.name} />
        <PasswordForm />
        <PreferencesCard />
        <Card title="Your organisations" className="lg:col-span-2">
          <p className="mb-3 text-sm text-ink-500">Signed in as {user.email}.</p>
          <ul className="list-disc pl-5 text-sm">
            {user.memberships.map((m) => (
              <li key={m.membershipId}>
                {m.organisationName}: {ROLE_LABELS[m.role]}
              </li>
            ))}
            {user.isPlatformAdmin && <li>Cellarpact platform admin</li>}
          </ul>
        </Card>
      </div>
    </>
  );
}

function NameForm({ initialName }: { initialName: string }) {
  const qc = useQueryClient();
  const [msg, setMsg] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const save = useMutation({ mutationFn: (v: ProfileInput) => api("/api/me", { method: "PATCH", body: v }) });
  const { register, handleSubmit, setError, formState } = useForm<ProfileInput>({
    resolver: zodResolver(profileSchema),
    defaultValues: { name: initialName },
  });
  const onSubmit = handleSubmit((v) =>
    save.mutate(v, {
      onSuccess: () => {
        setMsg({ tone: "success", text: "Your name has been saved." });
        void qc.invalidateQueries({ queryKey: sessionQueryOptions().queryKey });
      },
      onError: (err) => {
        const rest = applyServerErrors(err, setError, ["name"]);
        if (rest) setMsg({ tone: "error", text: rest });
      },
    }),
  );
  return (
    <Card title="Name">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {msg && <Notice tone={msg.tone}>{msg.text}</Notice>}
        <TextField label="Your name" autoComplete="name" error={formState.errors.name?.message} {...register("name")} />
        <Button type="submit" disabled={save.isPending}>
          Save name
        </Button>
      </form>
    </Card>
  );
}

function PasswordForm() {
  const [msg, setMsg] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const change = useMutation({ mutationFn: (v: ChangePasswordInput) => api("/api/me/password", { method: "POST", body: v }) });
  const { register, handleSubmit, setError, reset, formState } = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordSchema),
  });
  const onSubmit = handleSubmit((v) =>
    change.mutate(v, {
      onSuccess: () => {
        reset({ currentPassword: "", newPassword: "" });
        setMsg({ tone: "success", text: "Your password has been changed. Other sessions have been signed out." });
      },
      onError: (err) => {
        const rest = applyServerErrors(err, setError, ["currentPassword", "newPassword"]);
        if (rest) setMsg({ tone: "error", text: rest });
      },
    }),
  );
  return (
    <Card title="Password">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {msg && <Notice tone={msg.tone}>{msg.text}</Notice>}
        <CurrentPasswordField label="Current password" error={formState.errors.currentPassword?.message} {...register("currentPassword")} />
        <NewPasswordField error={formState.errors.newPassword?.message} {...register("newPassword")} />
        <Button type="submit" disabled={change.isPending}>
          Change password
        </Button>
      </form>
    </Card>
  );
}
