import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { Link, useNavigate, useParams } from "react-router-dom";
import { useState } from "react";
import { passwordsMatch, repeatedPassword } from "../../../shared/auth/schemas.ts";
import { api } from "../../lib/api-client.ts";
import { applyServerErrors } from "../../lib/form-errors.ts";
import { AuthLayout } from "../../components/ui/page.tsx";
import { NewPasswordField } from "../../components/credential-fields.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { z } from "zod";

const formSchema = z.object(repeatedPassword).refine(...passwordsMatch);
type FormValues = z.infer<typeof formSchema>;

export function ResetPasswordPage() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const [formError, setFormError] = useState<string | null>(null);
  const reset = useMutation({
    mutationFn: (password: string) => api("/api/auth/password-reset", { method: "POST", body: { token, password } }),
  });
  const { register, handleSubmit, setError, formState } = useForm<FormValues>({ resolver: zodResolver(formSchema) });

  const onSubmit = handleSubmit((v) =>
    reset.mutate(v.password, {
      onSuccess: () => navigate("/sign-in?reset=done", { replace: true }),
      onError: (err) => setFormError(applyServerErrors(err, setError, ["password"])),
    }),
  );

  return (
    <AuthLayout title="Choose a new password">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {formError && (
          <Notice tone="error">
            {formError}{" "}
            <Link to="/forgot-password" className="underline">
              Ask for a new link
            </Link>
          </Notice>
        )}
        <NewPasswordField error={formState.errors.password?.message} {...register("password")} />
        <NewPasswordField repeat label="Repeat the new password" error={formState.errors.confirm?.message} {...register("confirm")} />
        <Button type="submit" disabled={reset.isPending}>
          {reset.isPending ? "Saving…" : "Save the new password"}
        </Button>
      </form>
    </AuthLayout>
  );
}
