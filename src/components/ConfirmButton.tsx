import { useState, type ReactNode } from 'react';
import { Button } from './Button';

/**
 * A consequential action in two clicks: the first shows what will happen (and what is lost), the
 * second does it; "Keep" backs out. The same pattern as removing a project member.
 */
export function ConfirmButton({
  label,
  confirmLabel,
  warning,
  onConfirm,
  busy = false,
  busyLabel,
  disabled = false,
  variant = 'secondary',
  testId,
  ariaLabel,
}: {
  label: string;
  confirmLabel: string;
  /** One or two sentences: what the action does and what cannot be undone. */
  warning: ReactNode;
  onConfirm: (done: () => void) => void;
  busy?: boolean;
  busyLabel?: string;
  disabled?: boolean;
  variant?: 'secondary' | 'danger' | 'primary';
  testId?: string;
  ariaLabel?: string;
}) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button variant={variant} size="sm" disabled={disabled || busy} onClick={() => setAsking(true)} data-testid={testId} aria-label={ariaLabel}>
        {label}
      </Button>
    );
  }
  return (
    <span role="group" aria-label={`Confirm: ${label}`} className="inline-flex flex-wrap items-center justify-end gap-2 whitespace-normal">
      <span data-testid={testId && `${testId}-warning`} className="max-w-sm text-left text-sm text-stone-800">
        {warning}
      </span>
      <Button variant="danger" size="sm" busy={busy} busyLabel={busyLabel} onClick={() => onConfirm(() => setAsking(false))} data-testid={testId && `${testId}-confirm`}>
        {confirmLabel}
      </Button>
      <Button variant="quiet" size="sm" disabled={busy} onClick={() => setAsking(false)}>
        Keep
      </Button>
    </span>
  );
}
