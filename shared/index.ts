// The contract both sides use: zod schemas, inferred types, error codes, limits, roles.
export * from './roles';
export * from './errors';
export * from './limits';
export * from './schemas/auth';
export * from './schemas/users';
export * from './schemas/vessels';
export * from './schemas/logs';
export * from './schemas/curves';
export * from './schemas/recommendations';
export * from './schemas/plans';
export * from './schemas/overhaul';
export * from './schemas/savings'; export * from './schemas/fleet'; export * from './schemas/reports';
