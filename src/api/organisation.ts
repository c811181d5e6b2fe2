import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest, apiUpload } from './client';
import { adminKeys } from './keys';
import type { Organisation } from './types';

/** Where the logo is served (any signed-in account); `version` defeats the browser cache after an upload. */
export const organisationLogoUrl = (version: string | null) => `/api/organisation/logo${version ? `?v=${encodeURIComponent(version)}` : ''}`;

/** The consultancy printed on every report. */
export function useOrganisation() {
  return useQuery({
    queryKey: adminKeys.organisation,
    queryFn: ({ signal }) => apiRequest<Organisation>('/api/organisation', { signal }),
  });
}

export function useSaveOrganisation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string; address: string }) => apiRequest<Organisation>('/api/organisation', { method: 'PUT', body }),
    onSuccess: (org) => queryClient.setQueryData(adminKeys.organisation, org),
  });
}

export function useUploadLogo() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return apiUpload<{ type: string }>('/api/organisation/logo', form, { method: 'PUT' });
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.organisation }),
  });
}
