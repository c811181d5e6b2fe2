import type { Blocker } from 'react-router';
import { Button } from './Button';

/** Shown while a link out of a page with unsaved changes is held: leave (losing them) or stay. */
export function LeavePrompt({ blocker, what, testId = 'leave-guard' }: { blocker: Blocker; what: string; testId?: string }) {
  if (blocker.state !== 'blocked') return null;
  return (
    <div
      role="alertdialog"
      aria-labelledby={`${testId}-title`}
      data-testid={testId}
      ref={(el) => el?.scrollIntoView({ block: 'center' })}
      className="mb-4 rounded-lg border border-amber-300 bg-amber-50 px-4 py-3 text-amber-950"
    >
      <p id={`${testId}-title`} className="font-semibold">
        {what}
      </p>
      <p className="mt-2 flex gap-3">
        <Button size="sm" variant="danger" onClick={() => blocker.proceed?.()}>
          Leave without saving
        </Button>
        <Button size="sm" variant="secondary" onClick={() => blocker.reset?.()}>
          Stay and keep editing
        </Button>
      </p>
    </div>
  );
}
