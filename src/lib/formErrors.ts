import { ApiError, errorMessage, issueField } from '../api/errors';

export type FieldErrors = Record<string, string | undefined>;

export interface FormProblems {
  /** A sentence for the top of the form, or null when there is nothing to say. */
  summary: string | null;
  /** Messages keyed by input name, to show beside the input. */
  fields: FieldErrors;
  /** Issues that do not belong to any input on this form. */
  other: string[];
}

/** Split a mutation error into a summary and per-input messages for the inputs this form has. */
export function formProblems(error: unknown, fieldNames: readonly string[]): FormProblems {
  if (!error) return { summary: null, fields: {}, other: [] };
  const fields: FieldErrors = {};
  const other: string[] = [];
  if (error instanceof ApiError) {
    for (const issue of error.issues) {
      const name = issueField(issue);
      if (fieldNames.includes(name)) fields[name] = fields[name] ? `${fields[name]}; ${issue.message}` : issue.message;
      else other.push(name ? `${name}: ${issue.message}` : issue.message);
    }
  }
  return { summary: errorMessage(error), fields, other };
}

/** Merge client-side checks over server issues; the client's words win for the same input. */
export function mergeFieldErrors(server: FieldErrors, client: FieldErrors): FieldErrors {
  return { ...server, ...Object.fromEntries(Object.entries(client).filter(([, v]) => v)) };
}

export const hasErrors = (errors: FieldErrors): boolean => Object.values(errors).some(Boolean);
