/** Query keys of the overhaul planner; every overhaul query of a vessel sits under `vessel(id)`. */
export const overhaulKeys = {
  all: ['overhaul'] as const,
  vessel: (vesselId: string) => ['overhaul', 'vessel', vesselId] as const,
  fleet: () => ['overhaul', 'fleet'] as const,
};
