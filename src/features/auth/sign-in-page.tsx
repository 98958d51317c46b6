import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, Navigate, useNavigate, useSearchParams } from "react-router-dom";
import { useState } from "react";
import { signInSchema, type SignInInput } from "../../../shared/auth/schemas.ts";
import { useSignIn } from "./api/session.ts";
import { useSession } from "../../lib/session.ts";
import { AuthLayout } from "../../components/ui/page.tsx";
import { CurrentPasswordField, EmailField } from "../../components/credential-fields.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice } from "../../components/ui/states.tsx";
import { applyServerErrors } from "../../lib/form-errors.ts";

/** Only same-site paths are followed after sign-in. */
const safeNext = (next: string | null) => (next && next.startsWith("/") && !next.startsWith("//") ? next : "/");

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const session = useSession();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  if (session.data?.user) return <Navigate to={safeNext(params.get("next"))} replace />;

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    signIn.mutate(values, {
      onSuccess: () => navigate(safeNext(params.get("next")), { replace: true }),
      onError: (err) => setFormError(applyServerErrors(err, setError, ["email", "password"])),
    });
  });

  return (
    <AuthLayout title="Sign in">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {params.get("reset") === "done" && <Notice tone="success">Your password has been changed. Sign in with the new one.</Notice>}
        {formError && <Notice tone="error">{formError}</Notice>}
        <EmailField error={formState.errors.email?.message} {...register("email")} />
        <CurrentPasswordField error={formState.errors.password?.message} {...register("password")} />
        <Button type="submit" disabled={signIn.isPending}>
          {signIn.isPending ? "Signing in…" : "Sign in"}
        </Button>
        <Link to="/forgot-password" className="text-sm font-semibold text-must-700 underline">
          Forgot your password?
        </Link>
      </form>
    </AuthLayout>
  );
}
