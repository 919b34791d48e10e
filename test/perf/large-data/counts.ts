/** How much the large data set holds at full scale, and the same scaled down. */
export interface LargeDataCounts {
  recipes: number;
  users: number;
  trailEvents: number;
  cutRecords: number;
}

export const FULL_SCALE: LargeDataCounts = {
  recipes: 10_000,
  users: 200,
  trailEvents: 1_000_000,
  cutRecords: 100_000,
};

/** One person per role at least, two approvers (one may never approve a version they edited), two operators. */
export const MIN_USERS = 8;

/** Every count times `scale`, at least 1 (users at least one per role and a second approver). */
export function scaledCounts(scale: number): LargeDataCounts {
  if (!Number.isFinite(scale) || scale <= 0) throw new Error(`The scale must be a number above 0 (got ${scale}).`);
  const of = (n: number) => Math.max(1, Math.round(n * scale));
  return {
    recipes: of(FULL_SCALE.recipes),
    users: Math.max(MIN_USERS, of(FULL_SCALE.users)),
    trailEvents: of(FULL_SCALE.trailEvents),
    cutRecords: of(FULL_SCALE.cutRecords),
  };
}
