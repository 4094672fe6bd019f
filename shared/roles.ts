import { z } from 'zod';

/** The five roles of a company member. */
export const ROLES = ['admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  superintendent: 'Technical superintendent',
  chief_engineer: 'Chief engineer',
  energy_officer: 'Energy-efficiency officer',
  planner: 'Maintenance planner',
};

/**
 * What each role may do. The server checks these on every route; the client uses the same table only to decide
 * what to show. Chief engineers act on their own vessels only (their membership lists them).
 */
export const CAPABILITIES = {
  'fleet:read': ['admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner'],
  'users:manage': ['admin'],
  'company:settings': ['admin'],
  'outbox:read': ['admin'],
  'audit:read': ['admin', 'superintendent'],
  'vessels:create': ['admin'],
  'vessels:edit': ['admin', 'superintendent'],
  'vessels:delete': ['admin'],
  'plant:edit': ['admin', 'superintendent', 'chief_engineer'],
  /** Set a genset available / unavailable / must-run for recommendations. */
  'plant:status': ['chief_engineer', 'superintendent'],
  'logs:edit': ['chief_engineer', 'superintendent'],
  'recommendations:run': ['admin', 'superintendent', 'chief_engineer', 'energy_officer', 'planner'],
  'plans:approve': ['superintendent'],
  'overhaul:plan': ['planner', 'superintendent'],
  'overhaul:record': ['chief_engineer', 'superintendent'],
  'reports:read': ['admin', 'superintendent', 'energy_officer'],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof CAPABILITIES;

export function can(role: Role, capability: Capability): boolean {
  return (CAPABILITIES[capability] as readonly Role[]).includes(role);
}

/** Roles whose membership must name the vessels it covers. */
export const VESSEL_SCOPED_ROLES: readonly Role[] = ['chief_engineer'];
