/** Hard limits of the planner's search (beyond them it reports "more than"). */
export const LIMITS = { grade: 400, terms: 20000, cells: 4096 } as const;
