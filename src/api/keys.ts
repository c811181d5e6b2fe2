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
