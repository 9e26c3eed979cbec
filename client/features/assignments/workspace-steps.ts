/** The steps of an assignment's workspace, in the order the work is done. */
export const workspaceSteps = [
  { key: 'subject', label: 'Subject' },
  { key: 'comparables', label: 'Comparables' },
  { key: 'market-analysis', label: 'Market analysis' },
  { key: 'adjustments', label: 'Adjustments' },
  { key: 'review', label: 'Review' },
  { key: 'report', label: 'Report' },
] as const;

export type WorkspaceStepKey = (typeof workspaceSteps)[number]['key'];

export function findWorkspaceStep(key: string | undefined) {
  return workspaceSteps.find((step) => step.key === (key ?? 'subject'));
}

/** Steps whose page carries the cautions (the analysis and the report). */
export const stepsWithCautions: readonly WorkspaceStepKey[] = ['market-analysis', 'report'];
