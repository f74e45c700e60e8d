import { useRef, type ReactNode } from 'react';
import { Button, type ButtonProps } from './button';

interface ConfirmButtonProps extends Omit<ButtonProps, 'onClick'> {
  /** The question in the dialog, e.g. "Delete the board for everyone?" */
  title: string;
  description?: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
}

/**
 * A button that asks first, in a modal `<dialog>` (native focus trap and Escape to cancel),
 * for actions that cannot be undone.
 */
export function ConfirmButton({ title, description, confirmLabel, onConfirm, children, variant = 'danger', ...rest }: ConfirmButtonProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  return (
    <>
      <Button variant={variant} onClick={() => dialog.current?.showModal()} {...rest}>
        {children}
      </Button>
      <dialog
        ref={dialog}
        aria-label={title}
        className="m-auto w-full max-w-sm rounded-lg border border-mat-600 bg-mat-900 p-0 text-slate-200 shadow-2xl backdrop:bg-black/60"
      >
        <form method="dialog" className="flex flex-col gap-4 p-5">
          <h2 className="text-base font-semibold text-slate-100">{title}</h2>
          {description && <div className="text-sm text-slate-400">{description}</div>}
          <div className="flex justify-end gap-2">
            <Button type="submit" variant="ghost" autoFocus>
              Cancel
            </Button>
            <Button
              variant="danger"
              onClick={() => {
                dialog.current?.close();
                onConfirm();
              }}
            >
              {confirmLabel}
            </Button>
          </div>
        </form>
      </dialog>
    </>
  );
}
