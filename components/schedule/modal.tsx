'use client';

import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cn } from '@/lib/utils';

/**
 * A modal on the native <dialog> element: the browser traps focus, Escape closes it, and
 * focus returns to the opener. Open/closed is driven by `open`.
 */
export function Modal({
  open,
  title,
  onClose,
  children,
  wide,
  dismissable = true,
}: {
  open: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
  wide?: boolean;
  /** false: no close button and Escape does nothing — the user must pick an action. */
  dismissable?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
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
      onClose={onClose}
      onCancel={(e) => {
        e.preventDefault();
        if (dismissable) onClose();
      }}
      className={cn(
        'm-auto max-h-[90vh] w-[calc(100vw-2rem)] overflow-auto rounded-sm border border-line bg-panel p-0 text-ink backdrop:bg-ink/40',
        wide ? 'max-w-5xl' : 'max-w-lg',
      )}
    >
      {open ? (
        <div className="p-5">
          <div className="mb-4 flex items-start justify-between gap-4 border-b border-line pb-2">
            <h2 id={titleId} className="text-base font-semibold">
              {title}
            </h2>
            {dismissable ? (
              <button
                type="button"
                onClick={onClose}
                className="px-2 text-muted hover:text-ink"
                aria-label="Close"
              >
                ✕
              </button>
            ) : null}
          </div>
          {children}
        </div>
      ) : null}
    </dialog>
  );
}
