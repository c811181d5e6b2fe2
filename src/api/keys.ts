/** Query keys by resource, so a mutation can invalidate exactly what it changed. */
export const queryKeys = {
  me: ['me'] as const,
  users: ['users'] as const,
  userDirectory: ['users', 'directory'] as const,
  projects: ['projects'] as const,
  project: (projectId: string) => ['projects', projectId] as const,
  line: (lineId: string) => ['lines', lineId] as const,
  /** Every revision of one pick set shares the prefix, so one invalidation covers them all. */
  pickSet: (pickSetId: string) => ['picksets', pickSetId] as const,
  pickSetRevision: (pickSetId: string, revision: number | null) => ['picksets', pickSetId, revision ?? 'latest'] as const,
};

/** Model versions never change once saved, so their keys are simple. */
export const modelKeys = {
  version: (modelId: string) => ['models', modelId] as const,
};

/** Forward runs. A finished run never changes, so its results, fields and rays are cached for good. */
export const runKeys = {
  run: (runId: string) => ['runs', runId] as const,
  residuals: (runId: string) => ['runs', runId, 'residuals'] as const,
  rays: (runId: string, shotId: string) => ['runs', runId, 'rays', shotId] as const,
  field: (runId: string, shotId: string) => ['runs', runId, 'field', shotId] as const,
  /** The solved model version and its velocity grid, as the results page draws them. */
  model: (modelId: string) => ['run-models', modelId] as const,
  modelGrid: (modelId: string) => ['run-models', modelId, 'grid'] as const,
};

/** Reports: a project's list sits under the project's key, so refreshing the project refreshes it too. */
export const reportKeys = {
  list: (projectId: string) => ['projects', projectId, 'reports'] as const,
  report: (reportId: string) => ['reports', reportId] as const,
};

/** Administration and oversight: the mail outbox and each project's audit trail. */
export const adminKeys = {
  outbox: ['outbox'] as const,
  organisation: ['organisation'] as const,
  audit: (projectId: string) => ['projects', projectId, 'audit'] as const,
};

/** Inversions: a line's list, and one inversion with its finished section and residuals (never change once done). */
export const inversionKeys = {
  list: (lineId: string) => ['lines', lineId, 'inversions'] as const,
  inversion: (inversionId: string) => ['inversions', inversionId] as const,
  section: (inversionId: string) => ['inversions', inversionId, 'section'] as const,
  residuals: (inversionId: string) => ['inversions', inversionId, 'residuals'] as const,
};

/** Ensembles of an inversion: the inversion's list, one ensemble, its members, and its combined section (never changes once done). */
export const ensembleKeys = {
  list: (inversionId: string) => ['inversions', inversionId, 'ensembles'] as const,
  ensemble: (ensembleId: string) => ['ensembles', ensembleId] as const,
  members: (ensembleId: string) => ['ensembles', ensembleId, 'members'] as const,
  section: (ensembleId: string) => ['ensembles', ensembleId, 'section'] as const,
};
