import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiTokenListSchema, createdTokenSchema } from '../schemas/tokens';
import { apiRequest } from './client';
import { json } from './account';

export function useTokens(enabled: boolean) {
  return useQuery({ queryKey: ['tokens'], queryFn: () => apiRequest(apiTokenListSchema, '/tokens'), enabled });
}

export function useCreateToken() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => apiRequest(createdTokenSchema, '/tokens', json('POST', { name })),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['tokens'] }),
  });
}

export function useRevokeToken() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (tokenId: number) => apiRequest(z.null(), `/tokens/${tokenId}`, json('DELETE')),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['tokens'] }),
  });
}
