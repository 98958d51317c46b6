/**
 * Binding actions ask first, in the page: a modal <dialog> (focus moves into it, Escape cancels)
 * that names the action and its consequence. Never the browser's native confirm, which cannot be
 * styled, read consistently by screen readers, or say what will happen.
 */
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { Button } from "./button.tsx";

export interface ConfirmRequest {
  title: string;
  /** What will happen, in one or two sentences. */
  consequence: ReactNode;
  /** The button that carries the action out, e.g. "Send to the producer". */
  confirmLabel: string;
  tone?: "primary" | "danger";
  onConfirm: () => void;
}

export function ConfirmDialog({ request, onClose }: { request: ConfirmRequest | null; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (request && !d.open) d.showModal();
    if (!request && d.open) d.close();
  }, [request]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onClose={onClose}
      className="m-auto max-w-lg rounded-card border border-line bg-card p-6 text-ink-900 shadow-xl backdrop:bg-ink-900/40"
    >
      {request && (
        <div className="flex flex-col gap-4">
          <h2 id={titleId} className="text-lg font-semibold">
            {request.title}
          </h2>
          <div id={bodyId} className="text-sm">
            {request.consequence}
          </div>
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={onClose} autoFocus>
              Cancel
            </Button>
            <Button
              variant={request.tone === "danger" ? "danger" : "primary"}
              onClick={() => {
                request.onConfirm();
                onClose();
              }}
            >
              {request.confirmLabel}
            </Button>
          </div>
        </div>
      )}
    </dialog>
  );
}

/** `ask(request)` opens the dialog; render `dialog` once in the component. */
export function useConfirm() {
  const [request, setRequest] = useState<ConfirmRequest | null>(null);
  return { ask: setRequest, dialog: <ConfirmDialog request={request} onClose={() => setRequest(null)} /> };
}

/** A button whose action waits for the dialog's confirmation. */
export function ConfirmButton({
  children,
  request,
  variant = "primary",
  disabled,
}: {
  children: ReactNode;
  request: ConfirmRequest;
  variant?: "primary" | "secondary" | "danger" | "quiet";
  disabled?: boolean;
}) {
  const { ask, dialog } = useConfirm();
  return (
    <>
      <Button variant={variant} disabled={disabled} onClick={() => ask(request)}>
        {children}
      </Button>
      {dialog}
    </>
  );
}
