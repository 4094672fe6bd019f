/** Limits both sides enforce. */
export const LIMITS = {
  passwordMinLength: 10,
  passwordMaxLength: 200,
  nameMaxLength: 120,
  invitationHours: 72,
  resetHours: 2,
  sessionHours: 12,
  signInAttemptsPerEmail: 10,
  signInAttemptsPerAddress: 50,
  signInWindowMinutes: 15,
  maxGensetsPerVessel: 12,
} as const;
