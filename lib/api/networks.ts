import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  importResultSchema,
  networkDetailSchema,
  networkListSchema,
  versionDetailSchema,
  versionDiffSchema,
  type ImportRequest,
} from '../schemas/network';
import { apiRequest } from './client';

export type NetworkSort = 'name' | 'updated' | 'nodes' | 'lambda2';

export function useNetworks(q: string, sort: NetworkSort) {
  const params = new URLSearchParams({ sort, ...(q ? { q } : {}) });
  return useQuery({
    queryKey: ['networks', q, sort],
    queryFn: () => apiRequest(networkListSchema, `/networks?${params}`),
  });
}

/** Polls while any version's spectrum is still being computed, so its state tag follows. */
export function useNetwork(id: number) {
  return useQuery({
    queryKey: ['network', id],
    queryFn: () => apiRequest(networkDetailSchema, `/networks/${id}`),
    enabled: Number.isFinite(id),
    refetchInterval: (q) => (q.state.data?.versions.some((v) => v.summaryState === 'pending') ? 2000 : false),
  });
}

/**
 * Polls while the version's spectrum is still being computed; when it lands,
 * the network (its version list shows the state too) is refreshed as well.
 */
export function useNetworkVersion(id: number, version: number | undefined) {
  const client = useQueryClient();
  return useQuery({
    queryKey: ['network', id, 'version', version],
    queryFn: async () => {
      const previous = client.getQueryData<{ summaryState: string }>(['network', id, 'version', version]);
      const v = await apiRequest(versionDetailSchema, `/networks/${id}/versions/${version}`);
      if (previous?.summaryState === 'pending' && v.summaryState !== 'pending') {
        void client.invalidateQueries({ queryKey: ['network', id], exact: true });
        void client.invalidateQueries({ queryKey: ['networks'] });
      }
      return v;
    },
    enabled: Number.isFinite(id) && !!version,
    refetchInterval: (q) => (q.state.data?.summaryState === 'pending' ? 2000 : false),
  });
}

export function useVersionDiff(id: number, from: number | undefined, to: number | undefined) {
  return useQuery({
    queryKey: ['network', id, 'diff', from, to],
    queryFn: () => apiRequest(versionDiffSchema, `/networks/${id}/diff?from=${from}&to=${to}`),
    enabled: !!from && !!to && from !== to,
  });
}

export type ImportPayload = { fields: ImportRequest; file?: Blob & { name?: string } };

/** Uploads a file as multipart, or sends pasted text as JSON. */
export function useImportNetwork() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ fields, file }: ImportPayload) => {
      if (!file) return apiRequest(importResultSchema, '/networks/import', { method: 'POST', body: JSON.stringify(fields) });
      const form = new FormData();
      for (const [k, v] of Object.entries(fields)) {
        if (v === undefined || k === 'text') continue;
        form.append(k, typeof v === 'object' ? JSON.stringify(v) : String(v));
      }
      form.append('file', file, file.name ?? 'network.csv');
      return apiRequest(importResultSchema, '/networks/import', { method: 'POST', body: form });
    },
    onSuccess: () => client.invalidateQueries({ queryKey: ['networks'] }),
  });
}
