// The stages of `crest plan`, in the order they run, for progress reports (src/cli/progress.ts).

export const PLAN_STAGES = ['nights', 'visibility windows', 'candidate visits', 'optimisation', 'weather trials', 'time request'] as const;
export type PlanStage = (typeof PLAN_STAGES)[number];

/** Told as each stage begins; it must not change what the plan computes. */
export type StageListener = (stage: PlanStage) => void;
