import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Link, useNavigate, useParams } from "react-router-dom";
import { useState } from "react";
import { z } from "zod";
import { passwordsMatch, personNameSchema, repeatedPassword } from "../../../shared/auth/schemas.ts";
import { ROLE_LABELS, type OrganisationKind, type Role } from "../../../shared/auth/roles.ts";
import { api } from "../../lib/api-client.ts";
import { applyServerErrors } from "../../lib/form-errors.ts";
import { AuthLayout } from "../../components/ui/page.tsx";
import { TextField } from "../../components/ui/field.tsx";
import { NewPasswordField } from "../../components/credential-fields.tsx";
import { Button } from "../../components/ui/button.tsx";
import { ErrorState, LoadingState, Notice } from "../../components/ui/states.tsx";
import { sessionQueryOptions, type Session } from "../../lib/session.ts";

interface InvitationPreview {
  email: string;
  role: Role;
  organisationName: string;
  organisationKind: OrganisationKind;
  hasAccount: boolean;
}

const formSchema = z.object({ name: personNameSchema, ...repeatedPassword }).refine(...passwordsMatch);
type FormValues = z.infer<typeof formSchema>;

export function AcceptInvitationPage() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const qc = useQueryClient();
  const [formError, setFormError] = useState<string | null>(null);
  const preview = useQuery({
    queryKey: ["invitation", token],
    queryFn: () => api<InvitationPreview>(`/api/invitations/${encodeURIComponent(token)}`),
  });
  const accept = useMutation({
    mutationFn: (v: FormValues) =>
      api<Session>("/api/invitations/accept", { method: "POST", body: { token, name: v.name, password: v.password } }),
  });
  const { register, handleSubmit, setError, formState } = useForm<FormValues>({ resolver: zodResolver(formSchema) });

  const onSubmit = handleSubmit((v) =>
    accept.mutate(v, {
      onSuccess: (session) => {
        qc.setQueryData(sessionQueryOptions().queryKey, session);
        navigate("/", { replace: true });
      },
      onError: (err) => setFormError(applyServerErrors(err, setError, ["name", "password"])),
    }),
  );

  return (
    <AuthLayout title="Join Cellarpact">
      {preview.isPending && <LoadingState label="Checking your invitation…" />}
      {preview.isError && (
        <>
          <ErrorState error={preview.error} />
          <Link to="/sign-in" className="mt-4 inline-block text-sm font-semibold text-must-700 underline">
            Go to sign-in
          </Link>
        </>
      )}
      {preview.data && (
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          <p className="text-ink-700">
            You are invited to <strong>{preview.data.organisationName}</strong> as <strong>{ROLE_LABELS[preview.data.role]}</strong>. Your
            sign-in address will be <strong>{preview.data.email}</strong>.
          </p>
          {formError && <Notice tone="error">{formError}</Notice>}
          <TextField label="Your name" autoComplete="name" error={formState.errors.name?.message} {...register("name")} />
          <NewPasswordField label="Choose a password" error={formState.errors.password?.message} {...register("password")} />
          <NewPasswordField repeat label="Repeat the password" error={formState.errors.confirm?.message} {...register("confirm")} />
          <Button type="submit" disabled={accept.isPending}>
            {accept.isPending ? "Creating your account…" : "Accept and sign in"}
          </Button>
        </form>
      )}
    </AuthLayout>
  );
}
