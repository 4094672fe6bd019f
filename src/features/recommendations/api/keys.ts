/** Query keys of the recommendation feature (components never write them). */
export const recommendationKeys = {
  vessel: (vesselId: string) => ['recommendations', vesselId] as const,
};
