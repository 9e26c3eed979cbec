import { lazy, Suspense, type ComponentType } from 'react';
import type { AssignmentDetail } from '@contracts/assignments';
import { LoadingPanel } from '../../../components/ui/query-states';
import type { WorkspaceStepKey } from '../../../features/assignments/workspace-steps';

/** What every step page receives from the workspace. */
export interface StepProps {
  detail: AssignmentDetail;
}

/** One lazily loaded page per step: the map, the charts and the grid each stay in their own chunk. */
const steps: Record<WorkspaceStepKey, ComponentType<StepProps>> = {
  subject: lazy(() => import('./subject-step').then((m) => ({ default: m.SubjectStep }))),
  comparables: lazy(() => import('./comparables-step').then((m) => ({ default: m.ComparablesStep }))),
  'market-analysis': lazy(() => import('./market-analysis-step').then((m) => ({ default: m.MarketAnalysisStep }))),
  adjustments: lazy(() => import('./adjustments-step').then((m) => ({ default: m.AdjustmentsStep }))),
  review: lazy(() => import('./review-step').then((m) => ({ default: m.ReviewStep }))),
  report: lazy(() => import('./report-step').then((m) => ({ default: m.ReportStep }))),
};

export function StepContent({ step, detail }: { step: WorkspaceStepKey; detail: AssignmentDetail }) {
  const Step = steps[step];
  return (
    <Suspense fallback={<LoadingPanel label="Opening this step…" />}>
      <Step detail={detail} />
    </Suspense>
  );
}
