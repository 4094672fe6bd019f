import { z } from 'zod';
import { roleSchema } from '../roles';
import { emailSchema } from './auth';

export const memberSchema = z.object({
  membershipId: z.uuid(),
  userId: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  vesselIds: z.array(z.uuid()).nullable(),
  createdAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const createInvitationSchema = z
  .object({
    email: emailSchema,
    role: roleSchema,
    vesselIds: z.array(z.uuid()).default([]),
  })
  .refine((v) => v.role !== 'chief_engineer' || v.vesselIds.length > 0, {
    message: 'A chief engineer is invited for at least one vessel',
    path: ['vesselIds'],
  });
export type CreateInvitationInput = z.input<typeof createInvitationSchema>;

export const updateMemberSchema = z
  .object({ role: roleSchema, vesselIds: z.array(z.uuid()).default([]) })
  .refine((v) => v.role !== 'chief_engineer' || v.vesselIds.length > 0, {
    message: 'A chief engineer needs at least one vessel',
    path: ['vesselIds'],
  });
export type UpdateMemberInput = z.input<typeof updateMemberSchema>;

export const invitationSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: roleSchema,
  vesselIds: z.array(z.uuid()),
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
  createdAt: z.string(),
  status: z.enum(['pending', 'accepted', 'expired', 'revoked']),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const outboxMessageSchema = z.object({
  id: z.uuid(),
  toAddress: z.string(),
  subject: z.string(),
  bodyText: z.string(),
  status: z.string(),
  error: z.string().nullable(),
  createdAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const companySettingsSchema = z.object({
  name: z.string().trim().min(1).max(120),
  currency: z.string().regex(/^[A-Z]{3}$/, 'Use a three-letter ISO 4217 code such as USD'),
});
export type CompanySettings = z.infer<typeof companySettingsSchema>;

export const auditEntrySchema = z.object({
  id: z.number(),
  at: z.string(),
  userEmail: z.string().nullable(),
  entity: z.string(),
  entityId: z.string(),
  action: z.string(),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;
