/** Query keys of one vessel's logs; every logs query sits under these so a change refreshes them together. */
export const logsKeys = {
  all: (vesselId: string) => ['vessels', vesselId, 'logs'] as const,
  imports: (vesselId: string) => ['vessels', vesselId, 'log-imports'] as const,
};
