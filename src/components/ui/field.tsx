import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, forwardRef } from "react";

interface FieldShellProps {
  label: string;
  /** A caller-chosen id for the control; generated when absent. */
  id?: string;
  error?: string;
  hint?: string;
  children: (ids: { inputId: string; describedBy: string | undefined }) => ReactNode;
}

function FieldShell({ label, error, hint, id, children }: FieldShellProps) {
  const generated = useId();
  const inputId = id ?? generated;
  const hintId = `${inputId}-hint`;
  const errorId = `${inputId}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={inputId} className="text-sm font-semibold text-ink-900">
        {label}
      </label>
      {children({ inputId, describedBy })}
      {hint && (
        <p id={hintId} className="text-xs text-ink-500">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} role="alert" className="text-xs font-semibold text-alarm-700">
          {error}
        </p>
      )}
    </div>
  );
}

const inputClass =
  "min-w-0 rounded-md border border-line bg-white px-3 py-2 text-base text-ink-900 aria-[invalid=true]:border-alarm-700 focus:border-must-600";

export type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: string };

export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField({ label, error, hint, id, ...props }, ref) {
  return (
    <FieldShell label={label} error={error} hint={hint} id={id}>
      {({ inputId, describedBy }) => (
        <input
          ref={ref}
          id={inputId}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={inputClass}
          {...props}
        />
      )}
    </FieldShell>
  );
});

type SelectFieldProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  error?: string;
  hint?: string;
  options: readonly { value: string; label: string }[];
};

export const SelectField = forwardRef<HTMLSelectElement, SelectFieldProps>(function SelectField(
  { label, error, hint, options, id, ...props },
  ref,
) {
  return (
    <FieldShell label={label} error={error} hint={hint} id={id}>
      {({ inputId, describedBy }) => (
        <select
          ref={ref}
          id={inputId}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={inputClass}
          {...props}
        >
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </FieldShell>
  );
});

/** A file picker with its label; hands the chosen file on. */
export function FileField({ label, accept, hint, onFile }: { label: string; accept: string; hint?: string; onFile: (file: File) => void }) {
  return (
    <FieldShell label={label} hint={hint}>
      {({ inputId, describedBy }) => (
        <input
          id={inputId}
          type="file"
          accept={accept}
          aria-describedby={describedBy}
          className="text-sm"
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) onFile(file);
          }}
        />
      )}
    </FieldShell>
  );
}
