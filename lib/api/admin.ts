import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { outboxListSchema } from '../schemas/outbox';
import { userListSchema, userSummarySchema, type DeactivateBody, type InviteBody } from '../schemas/users';
import type { Role } from '../schemas/roles';
import { apiRequest } from './client';
import { json } from './account';

export function useUsers() {
  return useQuery({ queryKey: ['users'], queryFn: () => apiRequest(userListSchema, '/users') });
}

function useUserMutation<T, R>(call: (input: T) => Promise<R>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: call,
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['users'] });
      qc.invalidateQueries({ queryKey: ['outbox'] });
    },
  });
}

export function useInvite() {
  return useUserMutation((body: InviteBody) => apiRequest(userSummarySchema, '/users', json('POST', body)));
}

export function useSetRoles() {
  return useUserMutation(({ userId, roles }: { userId: number; roles: Role[] }) =>
    apiRequest(userSummarySchema, `/users/${userId}/roles`, json('PUT', { roles })),
  );
}

export function useDeactivate() {
  return useUserMutation(({ userId, reason }: { userId: number } & DeactivateBody) =>
    apiRequest(userSummarySchema, `/users/${userId}/deactivate`, json('POST', { reason })),
  );
}

export function useOutbox() {
  return useQuery({ queryKey: ['outbox'], queryFn: () => apiRequest(outboxListSchema, '/outbox'), refetchInterval: 10_000 });
}
