import type { FormProblems } from '../lib/formErrors';

/** The form-level error: the API's message plus any issues no input on the form owns. */
export function FormAlert({ problems, testId }: { problems: FormProblems; testId?: string }) {
  if (!problems.summary) return null;
  return (
    <div role="alert" data-testid={testId} className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-900">
      <p className="font-semibold">{problems.summary}</p>
      {problems.other.length > 0 && (
        <ul className="mt-1 list-disc pl-5 text-sm">
          {problems.other.map((m, i) => (
            <li key={i}>{m}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
