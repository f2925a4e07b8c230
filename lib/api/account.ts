import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  acceptedSchema,
  meSchema,
  passwordSetSchema,
  type ChangePasswordBody,
  type Me,
  type ResetRequestBody,
  type SetPasswordBody,
  type SignInBody,
} from '../schemas/auth';
import { ApiError, apiRequest } from './client';

const noContent = z.null();
export const json = (method: string, body?: unknown): RequestInit => ({ method, body: body === undefined ? undefined : JSON.stringify(body) });

/** The signed-in person, or null when nobody is (a 401 is an answer here, not an error). */
export function useMe() {
  return useQuery({
    queryKey: ['me'],
    queryFn: async (): Promise<Me | null> => {
      try {
        return await apiRequest(meSchema, '/auth/me');
      } catch (err) {
        if (err instanceof ApiError && err.status === 401) return null;
        throw err;
      }
    },
    retry: false,
    staleTime: 60_000,
  });
}

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInBody) => apiRequest(meSchema, '/auth/sign-in', json('POST', body)),
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(['me'], me);
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(noContent, '/auth/sign-out', json('POST')),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(['me'], null);
    },
  });
}

export function useChangePassword() {
  return useMutation({ mutationFn: (body: ChangePasswordBody) => apiRequest(noContent, '/auth/password', json('PUT', body)) });
}

export function useAcceptInvitation() {
  return useMutation({ mutationFn: (body: SetPasswordBody) => apiRequest(passwordSetSchema, '/auth/invitation/accept', json('POST', body)) });
}

export function useRequestReset() {
  return useMutation({ mutationFn: (body: ResetRequestBody) => apiRequest(acceptedSchema, '/auth/password-reset/request', json('POST', body)) });
}

export function useCompleteReset() {
  return useMutation({ mutationFn: (body: SetPasswordBody) => apiRequest(passwordSetSchema, '/auth/password-reset/complete', json('POST', body)) });
}
