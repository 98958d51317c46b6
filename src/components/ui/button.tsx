import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "quiet";

const styles: Record<Variant, string> = {
  primary: "bg-must-700 text-white hover:bg-must-800 disabled:bg-ink-500",
  secondary: "bg-card text-ink-900 border border-line hover:bg-must-50",
  danger: "bg-card text-alarm-700 border border-alarm-700/40 hover:bg-alarm-50",
  quiet: "text-must-700 underline-offset-2 hover:underline",
};

export function Button({ variant = "primary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      className={`inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed ${styles[variant]} ${className}`}
      {...props}
    />
  );
}
