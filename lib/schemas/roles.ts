import { z } from 'zod';

/** The four roles; a user may hold several. */
export const roles = ['admin', 'analyst', 'auditor', 'approver'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;
