import { useEffect, useId, useRef, type ReactNode } from "react";
import { Button } from "./Button";
import { FormError } from "./FormError";

interface ConfirmDialogProps {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  pending?: boolean;
  error?: string | null;
  onConfirm: () => void;
  onClose: () => void;
}

/**
 * A modal question before a destructive step. The native <dialog> gives focus trapping,
 * Escape to close and focus return to the opener.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  pending,
  error,
  onConfirm,
  onClose,
}: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onClose={onClose}
      className="m-auto w-full max-w-md rounded-lg border border-ink-200 bg-white p-0 shadow-xl backdrop:bg-ink-950/40"
    >
      <div className="space-y-4 p-5">
        <h2 id={titleId} className="text-lg font-semibold text-ink-950">
          {title}
        </h2>
        <div id={bodyId} className="text-sm text-ink-700">
          {children}
        </div>
        <FormError message={error} />
        <div className="flex justify-end gap-2 pt-1">
          <Button variant="secondary" onClick={onClose} autoFocus>
            Cancel
          </Button>
          <Button variant="danger" pending={pending} onClick={onConfirm}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
