import type { StepProps } from './step-registry';

// Placeholder until this step's page lands (working tree only).
export function ReportStep(_props: StepProps) {
  return <p className="text-ink-soft">This step is being built.</p>;
}
