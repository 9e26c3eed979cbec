import type { StepProps } from './step-registry';

// This step's page lands in its own commit.
export function AdjustmentsStep(_props: StepProps) {
  return <p className="text-ink-soft">This step is being built.</p>;
}
