import { useId, useState, type ReactNode } from 'react';
import { Button } from './Button';

/**
 * A button that opens a form below it. The form receives `close`, so it can fold itself
 * away after a successful save.
 */
export function Disclosure({ label, children, testId }: { label: string; children: (close: () => void) => ReactNode; testId?: string }) {
  const [open, setOpen] = useState(false);
  const id = useId();
  return (
    <div>
      <Button
        variant={open ? 'secondary' : 'primary'}
        aria-expanded={open}
        aria-controls={id}
        onClick={() => setOpen((o) => !o)}
        data-testid={testId}
      >
        {open ? 'Cancel' : label}
      </Button>
      <div id={id} hidden={!open}>
        {open && children(() => setOpen(false))}
      </div>
    </div>
  );
}
