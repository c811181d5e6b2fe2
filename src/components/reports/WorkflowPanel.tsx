import { useRef, useState } from 'react';
import { isRendering, useReportStep } from '../../api/reports';
import type { ProjectRole, ReportDetail, ReportStep } from '../../api/types';
import { formProblems } from '../../lib/formErrors';
import { Button } from '../Button';
import { FormAlert } from '../FormAlert';
import { StepForm } from './StepForm';
import { NEXT_FOR_TEAM, STEP_WORDING, stepsFor } from './wording';

/** Who each step e-mails, for the sentence shown when nobody could be. */
const RECIPIENTS: Record<ReportStep, string> = {
  submit: 'project lead',
  approve: 'author',
  return: 'author',
  share: 'client member',
};

interface Outcome {
  step: ReportStep;
  mailed: string[];
  mailError?: string;
}

function OutcomeNote({ outcome }: { outcome: Outcome }) {
  const done = STEP_WORDING[outcome.step].done;
  if (outcome.mailError) {
    return (
      <p role="status" data-testid="step-outcome" className="rounded-md border border-amber-300 bg-amber-50 px-4 py-2 text-amber-950">
        {done} {outcome.mailError} Tell the people concerned yourself.
      </p>
    );
  }
  return (
    <p role="status" data-testid="step-outcome" className="rounded-md bg-accent-50 px-4 py-2 text-accent-900">
      {done}{' '}
      {outcome.mailed.length > 0 ? (
        <>
          E-mail sent to <strong data-testid="step-mailed">{outcome.mailed.join(', ')}</strong>.
        </>
      ) : (
        `Nobody was e-mailed: this project has no ${RECIPIENTS[outcome.step]} with an active account.`
      )}
    </p>
  );
}

/** A second thought before a step, when the PDF the step is about is not there to read. */
function pdfWarning(step: ReportStep, report: ReportDetail): string | null {
  if (step === 'return') return null;
  if (report.render.state === 'failed') return 'The PDF of this report could not be made, so there is nothing to read. Consider starting a new report from the run.';
  if (isRendering(report.render.state) && step !== 'share') return 'The PDF is still being prepared; you may want to read it before going on.';
  return null;
}

/**
 * Where the report stands, what happens next, and the steps this role may take now. Each step
 * asks for confirmation (with an optional comment, required to return) and then says who was e-mailed.
 */
export function WorkflowPanel({ report, role }: { report: ReportDetail; role: ProjectRole | null }) {
  const step = useReportStep(report.id);
  const [open, setOpen] = useState<ReportStep | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const buttons = useRef<HTMLDivElement>(null);
  const steps = stepsFor(role, report.status);
  // A step someone else has made impossible meanwhile (the report moved on) folds its form away.
  const shown = open && steps.includes(open) ? open : null;
  // The API refuses to share until the approved render exists (409); say so before anyone tries.
  const shareWaits = !report.render.approvedRenderedAt;

  function openStep(s: ReportStep) {
    step.reset();
    setOutcome(null);
    setOpen(s);
  }

  function cancel() {
    setOpen(null);
    step.reset();
    buttons.current?.querySelector('button')?.focus();
  }

  function confirm(s: ReportStep, comment: string) {
    step.mutate(
      { step: s, comment },
      {
        onSuccess: (result) => {
          setOpen(null);
          setOutcome({ step: s, mailed: result.mailed, mailError: result.mailError });
        },
      },
    );
  }

  return (
    <div data-testid="workflow-panel" className="rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
      <h2 className="text-lg font-semibold text-stone-900">What happens next</h2>
      <p data-testid="report-next" className="mt-1 max-w-prose text-stone-700">
        {NEXT_FOR_TEAM[report.status]}
      </p>
      {outcome && (
        <div className="mt-4">
          <OutcomeNote outcome={outcome} />
        </div>
      )}
      {step.isError && !shown && (
        <div className="mt-4">
          <FormAlert problems={formProblems(step.error, [])} testId="step-refused" />
        </div>
      )}
      {steps.length > 0 ? (
        <div ref={buttons} className="mt-4 flex flex-wrap gap-3" role="group" aria-label="Review steps">
          {steps.map((s) => (
            <Button
              key={s}
              variant={s === 'return' ? 'secondary' : 'primary'}
              aria-expanded={shown === s}
              className={shown === s ? 'ring-2 ring-accent-600/50 ring-offset-1' : ''}
              onClick={() => (shown === s ? cancel() : openStep(s))}
              disabled={s === 'share' && shareWaits}
              aria-describedby={s === 'share' && shareWaits ? 'share-waits' : undefined}
              data-testid={`step-${s}`}
            >
              {STEP_WORDING[s].button}
            </Button>
          ))}
        </div>
      ) : null}
      {steps.includes('share') && shareWaits && (
        <p id="share-waits" data-testid="share-waits" className="mt-2 text-sm text-stone-600">
          {report.render.state === 'failed'
            ? 'The approved PDF could not be made, so there is nothing to share yet. The client never receives the draft.'
            : 'The approved PDF is being made; it can be shared once it is ready (the client never receives the draft).'}
        </p>
      )}
      {steps.length === 0 && (
        <p data-testid="no-steps" className="mt-3 text-sm text-stone-600">
          {role === 'geophysicist' || role === 'lead' || role === 'field_tech'
            ? 'There is no step for you to take on this report right now.'
            : 'Only project members can take review steps.'}
        </p>
      )}
      {shown && (
        <StepForm
          key={shown}
          step={shown}
          busy={step.isPending}
          error={step.error}
          warning={pdfWarning(shown, report)}
          onConfirm={(comment) => confirm(shown, comment)}
          onCancel={cancel}
        />
      )}
    </div>
  );
}
