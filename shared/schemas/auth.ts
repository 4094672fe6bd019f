import { z } from 'zod';
import { LIMITS } from '../limits';
import { roleSchema } from '../roles';

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid e-mail address' }));
export const passwordSchema = z
  .string()
  .min(LIMITS.passwordMinLength, `Use at least ${LIMITS.passwordMinLength} characters`)
  .max(LIMITS.passwordMaxLength, `Use at most ${LIMITS.passwordMaxLength} characters`);
export const personNameSchema = z.string().trim().min(1, 'Enter a name').max(LIMITS.nameMaxLength);

export const signInSchema = z.object({ email: emailSchema, password: z.string().min(1, 'Enter your password') });
export type SignInInput = z.infer<typeof signInSchema>;

export const forgotPasswordSchema = z.object({ email: emailSchema });
export const resetPasswordSchema = z.object({ token: z.string().min(20), password: passwordSchema });
export const acceptInvitationSchema = z.object({ token: z.string().min(20), name: personNameSchema, password: passwordSchema });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

export const meSchema = z.object({
  user: z.object({ id: z.uuid(), email: z.string(), name: z.string() }),
  company: z.object({ id: z.uuid(), name: z.string(), currency: z.string() }),
  role: roleSchema,
  /** null: all vessels of the company; else the vessels this member may see. */
  vesselIds: z.array(z.uuid()).nullable(),
  sessionExpiresAt: z.string(),
});
export type Me = z.infer<typeof meSchema>;

export const invitationPreviewSchema = z.object({
  email: z.string(),
  companyName: z.string(),
  role: roleSchema,
  expiresAt: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;
