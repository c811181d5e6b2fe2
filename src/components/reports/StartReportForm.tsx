import { useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { useStartReport } from '../../api/reports';
import { formProblems, hasErrors, mergeFieldErrors, type FieldErrors } from '../../lib/formErrors';
import { Button } from '../Button';
import { SelectField, TextAreaField, TextField } from '../Field';
import { FormAlert } from '../FormAlert';

const FIELDS = ['shotId', 'isoVelocity', 'acquisitionNotes'] as const;

/** The server's default depth surface; a common top-of-rock velocity (common practice, no source). */
const DEFAULT_ISO_VELOCITY = 2500;
const MAX_ISO_VELOCITY = 10_000;

interface StartReportFormProps {
  /** A finished run (with its shots: the PDF's section shows the wavefronts of one) or a finished inversion. */
  source: { runId: string; shotIds: string[] } | { inversionId: string; coverageThreshold: number };
  /** Called with the new report's id; by default the browser goes to the report's page. */
  onStarted?: (reportId: string) => void;
}

/**
 * Start a PDF report of a finished run or inversion: which shot the section shows (runs), the
 * velocity whose depth is tabulated along the line (m/s), and notes on the acquisition. An
 * inversion's report greys the section where the page does (its coverage threshold). The worker renders it.
 */
export function StartReportForm({ source, onStarted }: StartReportFormProps) {
  const navigate = useNavigate();
  const shotIds = 'runId' in source ? source.shotIds : [];
  const start = useStartReport('runId' in source ? { runId: source.runId } : { inversionId: source.inversionId });
  const [shotId, setShotId] = useState(shotIds[0] ?? '');
  const [velocity, setVelocity] = useState(String(DEFAULT_ISO_VELOCITY));
  const [notes, setNotes] = useState('');
  const [checks, setChecks] = useState<FieldErrors>({});
  const velocityRef = useRef<HTMLInputElement>(null);

  const problems = formProblems(start.error, FIELDS);
  const errors = mergeFieldErrors(problems.fields, checks);

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const v = Number(velocity.trim().replace(',', '.'));
    const found: FieldErrors = {
      isoVelocity:
        velocity.trim() === '' || !Number.isFinite(v)
          ? 'Give a velocity in m/s, for example 2500.'
          : v <= 0 || v > MAX_ISO_VELOCITY
            ? `Give a velocity above 0 and at most ${MAX_ISO_VELOCITY.toLocaleString('en-GB')} m/s.`
            : undefined,
    };
    setChecks(found);
    if (hasErrors(found)) {
      start.reset();
      velocityRef.current?.focus();
      return;
    }
    const body = {
      ...(shotId ? { shotId } : {}),
      ...('inversionId' in source ? { coverageThreshold: source.coverageThreshold } : {}),
      isoVelocity: v,
      ...(notes.trim() ? { acquisitionNotes: notes.trim() } : {}),
    };
    start.mutate(body, { onSuccess: ({ id }) => (onStarted ? onStarted(id) : navigate(`/reports/${id}`)) });
  }

  return (
    <form noValidate onSubmit={onSubmit} data-testid="start-report-form" className="flex flex-col gap-4">
      <FormAlert problems={problems} testId="start-report-error" />
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        {shotIds.length > 0 && (
          <SelectField label="Shot for the velocity section" name="shotId" value={shotId} onChange={(e) => (setShotId(e.target.value), start.reset())} error={errors.shotId} hint="The section shows this shot’s wavefronts and rays.">
            {shotIds.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </SelectField>
        )}
        <TextField
          label="Depth surface velocity (m/s)"
          name="isoVelocity"
          inputMode="decimal"
          value={velocity}
          inputRef={velocityRef}
          error={errors.isoVelocity}
          hint="The report tabulates the depth to this velocity along the line, e.g. the top of rock."
          onChange={(e) => (setVelocity(e.target.value), setChecks({}), start.reset())}
        />
      </div>
      <TextAreaField
        label="Acquisition notes"
        name="acquisitionNotes"
        maxLength={4000}
        value={notes}
        error={errors.acquisitionNotes}
        hint="Optional: source, weather, noise, anything a reader should know. The line’s own notes are used if left empty."
        onChange={(e) => setNotes(e.target.value)}
      />
      <div>
        <Button type="submit" busy={start.isPending} busyLabel="Starting…" data-testid="start-report">
          Make report
        </Button>
      </div>
    </form>
  );
}
