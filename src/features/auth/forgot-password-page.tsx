import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { passwordResetRequestSchema, type PasswordResetRequestInput } from "../../../shared/auth/schemas.ts";
import { api, errorMessage } from "../../lib/api-client.ts";
import { AuthLayout } from "../../components/ui/page.tsx";
import { EmailField } from "../../components/credential-fields.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";

export function ForgotPasswordPage() {
  const request = useMutation({
    mutationFn: (input: PasswordResetRequestInput) =>
      api<{ message: string }>("/api/auth/password-reset/request", { method: "POST", body: input }),
  });
  const { register, handleSubmit, formState } = useForm<PasswordResetRequestInput>({ resolver: zodResolver(passwordResetRequestSchema) });

  return (
    <AuthLayout title="Reset your password">
      {request.isSuccess ? (
        <Notice tone="success">{request.data.message} The link works once, for one hour.</Notice>
      ) : (
        <form onSubmit={handleSubmit((v) => request.mutate(v))} noValidate className="flex flex-col gap-4">
          <p className="text-sm text-ink-500">Enter the address you sign in with. We will mail you a link to choose a new password.</p>
          {request.isError && <Notice tone="error">{errorMessage(request.error)}</Notice>}
          <EmailField error={formState.errors.email?.message} {...register("email")} />
          <Button type="submit" disabled={request.isPending}>
            {request.isPending ? "Sending…" : "Send the reset link"}
          </Button>
        </form>
      )}
      <Link to="/sign-in" className="mt-4 inline-block text-sm font-semibold text-must-700 underline">
        Back to sign-in
      </Link>
    </AuthLayout>
  );
}
