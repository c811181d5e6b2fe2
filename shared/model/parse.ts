/**
 * parseModelFile: the one entry point for reading a "timefield-model/1" document
 * (already JSON-decoded). Runs the zod schema, whose final step runs the rule checks,
 * and flattens every problem to { path: 'layers[1].base[3]', message }.
 */
import { modelFileSchema, type ModelFile } from '../schemas/model';
import { formatJsonPath } from './rules';

export interface ModelPathIssue {
  path: string;
  message: string;
}

export type ParseModelResult = { ok: true; model: ModelFile } | { ok: false; issues: ModelPathIssue[] };

export function parseModelFile(json: unknown): ParseModelResult {
  const result = modelFileSchema.safeParse(json);
  if (result.success) return { ok: true, model: result.data };
  return {
    ok: false,
    issues: result.error.issues.flatMap((issue) =>
      // An unknown key is named by its own path (`layers[0].junk`), not its object's.
      issue.code === 'unrecognized_keys'
        ? issue.keys.map((key) => ({ path: formatJsonPath([...issue.path, key]), message: 'unknown key; not part of the model file format' }))
        : [{ path: formatJsonPath(issue.path), message: issue.message }],
    ),
  };
}

/** One line per issue, the form FORMATS.md shows: `layers[1].base[3]: x must increase ...`. */
export function formatModelIssues(issues: readonly ModelPathIssue[]): string {
  return issues.map((i) => `${i.path}: ${i.message}`).join('\n');
}
