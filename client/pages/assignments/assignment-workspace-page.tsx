import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { statusLabels } from '@contracts/assignments';
import { Cautions } from '../../components/ui/cautions';
import { PageHeader } from '../../components/ui/page-header';
import { ErrorPanel, LoadingPanel } from '../../components/ui/query-states';
import { StepBar } from '../../components/ui/step-bar';
import { assignmentQueries } from '../../features/assignments/api/assignment-queries';
import { AssignmentFacts } from '../../features/assignments/components/assignment-facts';
import { findWorkspaceStep, stepsWithCautions, workspaceSteps } from '../../features/assignments/workspace-steps';
import { RoleGate } from '../../features/auth/components/role-gate';
import { NotFoundPage } from '../errors/not-found-page';
import { StepContent } from './steps/step-registry';

/** Assignment ids are positive whole numbers; anything else is no assignment at all. */
function parseAssignmentId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,9}$/.test(raw)) return null;
  const id = Number(raw);
  return id <= 2_147_483_647 ? id : null;
}

/** The workspace of one assignment: its address and key facts, the step bar, the current step. */
export function AssignmentWorkspacePage() {
  const params = useParams();
  const id = parseAssignmentId(params.id);
  const step = findWorkspaceStep(params.step);
  if (id === null) return <NotFoundPage what="There is no assignment at this address" />;
  if (!step) return <NotFoundPage what="This assignment has no such step" />;
  return (
    <RoleGate roles={['appraiser', 'reviewer']}>
      <Workspace id={id} step={step} />
    </RoleGate>
  );
}

function Workspace({ id, step }: { id: number; step: (typeof workspaceSteps)[number] }) {
  const detail = useQuery(assignmentQueries.detail(id));
  if (detail.isPending) return <LoadingPanel label={`Opening assignment ${id}…`} />;
  if (detail.isError) {
    return (
      <div className="py-6">
        <title>{`Assignment ${id} · Compline`}</title>
        <ErrorPanel title={`Assignment ${id} could not be opened`} error={detail.error} onRetry={() => void detail.refetch()} retrying={detail.isFetching} />
      </div>
    );
  }

  const { assignment } = detail.data;
  const steps = workspaceSteps.map((s) => ({ key: s.key, label: s.label, href: `/assignments/${id}/${s.key}` }));
  return (
    <div className="flex flex-col gap-6">
      <title>{`${step.label} · ${assignment.subjectAddress} · Compline`}</title>
      <PageHeader
        eyebrow={
          <>
            <span className="figures">Assignment {id}</span> · {statusLabels[assignment.status]}
          </>
        }
        title={assignment.subjectAddress}
        description={<AssignmentFacts assignment={assignment} />}
      />
      <StepBar steps={steps} current={step.key} />
      <section aria-labelledby="step-title" className="flex flex-col gap-4">
        <h2 id="step-title" className="text-xl font-semibold">
          {step.label}
        </h2>
        <StepContent step={step.key} detail={detail.data} />
      </section>
      {stepsWithCautions.includes(step.key) && <Cautions />}
    </div>
  );
}
