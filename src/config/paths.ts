// Every address of the client in one place. Pages link with `paths.x.href(...)`; the router uses `paths.x.pattern`.

export const paths = {
  signIn: {
    pattern: '/sign-in',
    href: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  forgotPassword: { pattern: '/forgot-password', href: () => '/forgot-password' },
  resetPassword: { pattern: '/reset-password', href: () => '/reset-password' },
  acceptInvitation: { pattern: '/accept-invitation', href: () => '/accept-invitation' },
  fleet: { pattern: '/', href: () => '/' },
  vessel: { pattern: '/vessels/:vesselId', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}` },
  vesselLogs: { pattern: '/vessels/:vesselId/logs', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/logs` },
  vesselLogImport: { pattern: '/vessels/:vesselId/logs/import', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/logs/import` },
  vesselFuelLots: { pattern: '/vessels/:vesselId/fuel-lots', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/fuel-lots` },
  vesselCurves: { pattern: '/vessels/:vesselId/curves', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/curves` },
  vesselRecommend: { pattern: '/vessels/:vesselId/recommend', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/recommend` },
  vesselGuideline: { pattern: '/vessels/:vesselId/guideline', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/guideline` },
  vesselPlans: { pattern: '/vessels/:vesselId/plans', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/plans` },
  vesselRules: { pattern: '/vessels/:vesselId/rules', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/rules` },
  vesselOverhaul: { pattern: '/vessels/:vesselId/overhaul', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/overhaul` },
  fleetOverhaul: { pattern: '/fleet/overhaul', href: () => '/fleet/overhaul' },
  vesselSavings: { pattern: '/vessels/:vesselId/savings', href: (vesselId: string) => `/vessels/${encodeURIComponent(vesselId)}/savings` },
  vesselReport: {
    pattern: '/vessels/:vesselId/report',
    href: (vesselId: string, month?: string) => `/vessels/${encodeURIComponent(vesselId)}/report${month ? `?month=${month}` : ''}`,
  },
  fleetBenchmark: { pattern: '/fleet/benchmark', href: () => '/fleet/benchmark' },
  fleetReport: { pattern: '/fleet/report', href: (month?: string) => `/fleet/report${month ? `?month=${month}` : ''}` },
  subscriptions: { pattern: '/subscriptions', href: () => '/subscriptions' },
  adminFuelPrices: { pattern: '/admin/fuel-prices', href: () => '/admin/fuel-prices' },
  adminUsers: { pattern: '/admin/users', href: () => '/admin/users' },
  adminOutbox: { pattern: '/admin/outbox', href: () => '/admin/outbox' },
  adminSettings: { pattern: '/admin/settings', href: () => '/admin/settings' },
  audit: { pattern: '/audit', href: () => '/audit' },
} as const;

/** Accepts a `next` parameter only when it is a path on this site (no scheme, no protocol-relative host). */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.fleet.href();
  return next;
}
