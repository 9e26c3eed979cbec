import { useQuery } from '@tanstack/react-query';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { useSessionUser } from '../../../features/auth/hooks/use-session-user';
import { analysisQueries } from '../../../features/market-analysis/api/analysis-queries';
import { MarketAnalysisView } from '../../../features/market-analysis/components/market-analysis-view';
import type { StepProps } from './step-registry';

/**
 * The Market analysis step: per neighbourhood, price against floor area with the fitted line and
 * its prediction band, the figures, the residuals, the market-conditions trend and the flagged
 * sales. The charts (recharts) load with this step's chunk, never with the entry.
 */
export function MarketAnalysisStep({ detail }: StepProps) {
  const { role } = useSessionUser();
  const id = detail.assignment.id;
  const analysis = useQuery(analysisQueries.analysis(id));
  // Only names the sales in tooltips and lists: the page works (with "Sale 12") without it.
  const sales = useQuery(analysisQueries.saleNames(id));

  if (analysis.isPending) return <LoadingPanel label="Fitting the sales…" />;
  if (analysis.isError) {
    return (
      <ErrorPanel title="The market analysis could not be loaded" error={analysis.error} onRetry={() => void analysis.refetch()} retrying={analysis.isFetching} />
    );
  }
  return <MarketAnalysisView analysis={analysis.data} sales={sales.data} assignment={detail.assignment} role={role} />;
}
