import { useQuery } from '@tanstack/react-query';
import { apiRequest } from './client';
import { adminKeys } from './keys';
import type { AuditEntry, OutboxMessage } from './types';

/** Mail the local sink received, newest first (admin only). */
export function useOutbox() {
  return useQuery({
    queryKey: adminKeys.outbox,
    queryFn: ({ signal }) => apiRequest<OutboxMessage[]>('/api/outbox', { signal }),
  });
}

/** A project's audit trail, newest first (project lead, admin). */
export function useAuditTrail(projectId: string) {
  return useQuery({
    queryKey: adminKeys.audit(projectId),
    queryFn: ({ signal }) => apiRequest<AuditEntry[]>(`/api/projects/${encodeURIComponent(projectId)}/audit`, { signal }),
    enabled: Boolean(projectId),
  });
}
