/** The e-mail and password inputs of the sign-in, reset, invitation and profile forms, with the autocomplete hints browsers and password managers read. */
import { forwardRef } from "react";
import { TextField, type TextFieldProps } from "./ui/field.tsx";
import { PASSWORD_MIN } from "../../shared/auth/schemas.ts";

type Props = Omit<TextFieldProps, "type" | "autoComplete" | "label"> & { label?: string };

export const EmailField = forwardRef<HTMLInputElement, Props>(function EmailField({ label = "E-mail address", ...props }, ref) {
  return <TextField ref={ref} label={label} type="email" autoComplete="username" {...props} />;
});

export const CurrentPasswordField = forwardRef<HTMLInputElement, Props>(function CurrentPasswordField(
  { label = "Password", ...props },
  ref,
) {
  return <TextField ref={ref} label={label} type="password" autoComplete="current-password" {...props} />;
});

/** `repeat` is the second entry of a new password, which carries no length hint. */
export const NewPasswordField = forwardRef<HTMLInputElement, Props & { repeat?: boolean }>(function NewPasswordField(
  { label = "New password", repeat = false, ...props },
  ref,
) {
  const hint = repeat ? undefined : `At least ${PASSWORD_MIN} characters.`;
  return <TextField ref={ref} label={label} type="password" autoComplete="new-password" hint={hint} {...props} />;
});
