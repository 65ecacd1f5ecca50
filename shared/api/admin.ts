import { z } from 'zod';

/** GET /api/v1/admin/users (admin only) → { users: AdminUserRow[] } */
export const adminUserRowSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  isAdmin: z.boolean(),
  active: z.boolean(),
  lastSignInAt: z.string().nullable(),
  createdAt: z.string(),
});
export type AdminUserRow = z.infer<typeof adminUserRowSchema>;
export const adminUsersResponseSchema = z.object({ users: z.array(adminUserRowSchema) });

/** GET /api/v1/admin/audit?limit=&before= (admin only) → { entries: AuditEntry[], nextBefore: number|null } */
export const auditEntrySchema = z.object({
  id: z.number().int(),
  at: z.string(),
  actorId: z.number().int().nullable(),
  actorName: z.string().nullable(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string().nullable(),
  before: z.unknown().nullable(),
  after: z.unknown().nullable(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;
export const auditResponseSchema = z.object({
  entries: z.array(auditEntrySchema),
  nextBefore: z.number().int().nullable(),
});
