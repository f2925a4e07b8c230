import { useQuery } from '@tanstack/react-query';
import { healthSchema } from '../schemas/health';
import { apiRequest } from './client';

export function useHealth() {
  return useQuery({
    queryKey: ['health'],
    queryFn: () => apiRequest(healthSchema, '/health'),
    refetchInterval: 60_000,
  });
}
