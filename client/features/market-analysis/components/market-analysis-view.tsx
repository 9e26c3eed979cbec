import { useNavigate, useSearchParams } from 'react-router-dom';
import type { Analysis } from '@contracts/analysis';
import type { Assignment } from '@contracts/assignments';
import type { Role } from '@contracts/auth';
import type { Sale } from '@contracts/sales';
import { formatIsoDate } from '../../../lib/format-date';
import { useTimeAdjustment, timeAdjustmentRefusal } from '../hooks/use-time-adjustment';
import { figureFormat } from '../lib/figure-format';
import { flagsBySale } from '../lib/flag-words';
import { chooseGroup, GROUP_PARAM, orderedGroups, trendOf } from '../lib/group-choice';
import { saleHref, saleLookup } from '../lib/sale-lookup';
import { AnalysisCard } from './analysis-card';
import { ExcludedSales } from './excluded-sales';
import { FittedGroup } from './fitted-group';
import { FlaggedSales } from './flagged-sales';
import { GROUP_PANEL_ID, groupTabId, NeighbourhoodSwitcher } from './neighbourhood-switcher';
import { TimeAdjustmentSwitch } from './time-adjustment-switch';
import { TrendPanel } from './trend-panel';

interface Props {
  analysis: Analysis;
  sales: readonly Sale[] | undefined;
  assignment: Assignment;
  role: Role;
}

function lockReason(role: Role, assignment: Assignment): string | null {
  if (role !== 'appraiser') return 'Only the appraiser can change this setting.';
  if (assignment.status !== 'in_progress' && assignment.status !== 'revisions_requested') {
    return 'The assignment is with the reviewer or signed, so its settings cannot change now.';
  }
  return null;
}

/** The market analysis of one assignment: pick a neighbourhood, then read its fit from the scatter
 * down to the flagged sales. The workspace adds the cautions below. */
export function MarketAnalysisView({ analysis, sales, assignment, role }: Props) {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const timeAdjustment = useTimeAdjustment(assignment.id, assignment.version);

  const groups = orderedGroups(analysis);
  const group = chooseGroup(groups, params.get(GROUP_PARAM), analysis.subjectGroup);
  const format = figureFormat(analysis.currency, analysis.areaUnit);
  const lookup = saleLookup(sales, analysis);
  const openSale = (saleId: number) => navigate(saleHref(assignment.id, saleId));
  const choose = (name: string) =>
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        next.set(GROUP_PARAM, name);
        return next;
      },
      { replace: true },
    );

  if (!group) {
    return <p className="text-ink-soft">There are no usable sales yet: add sales on the Comparables step and their analysis appears here.</p>;
  }
  const flags = flagsBySale(group);
  const flaggedIds = new Set(flags.keys());

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-2">
        <NeighbourhoodSwitcher groups={groups} chosen={group.neighbourhood} subjectGroup={analysis.subjectGroup} onChoose={choose} />
        <p className="text-[0.8125rem] text-ink-faint">
          {analysis.timeAdjustment ? 'Time-adjusted prices' : 'Prices as sold'} · effective date{' '}
          <span className="figures">{formatIsoDate(analysis.effectiveDate)}</span> · floor area in {format.unit}, prices in {analysis.currency}
        </p>
      </div>

      <div role="tabpanel" id={GROUP_PANEL_ID} aria-labelledby={groupTabId(group.neighbourhood)} className="flex flex-col gap-5">
        {group.fit && !group.refusal ? (
          <FittedGroup analysis={analysis} group={{ ...group, fit: group.fit }} flags={flags} format={format} lookup={lookup} onOpen={openSale} />
        ) : (
          <AnalysisCard title={`No line for ${group.neighbourhood}`} labelId="refusal-title">
            <p className="text-[0.9375rem] text-ink" data-testid="group-refusal">
              {group.refusal?.message ?? 'These sales cannot be fitted.'}
            </p>
          </AnalysisCard>
        )}

        <AnalysisCard
          title="Market conditions"
          labelId="trend-title"
          description={`Price per ${format.unit} against months before the effective date, ${group.neighbourhood}.`}
        >
          <TrendPanel
            trend={trendOf(analysis, group)}
            flaggedIds={flaggedIds}
            format={format}
            lookup={lookup}
            onOpen={openSale}
            chartHeight={260}
            control={
              <TimeAdjustmentSwitch
                on={analysis.timeAdjustment}
                busy={timeAdjustment.isPending}
                lockedBecause={lockReason(role, assignment)}
                refusal={timeAdjustment.isError ? timeAdjustmentRefusal(timeAdjustment.error) : null}
                onChange={(on) => timeAdjustment.mutate(on)}
              />
            }
          />
        </AnalysisCard>

        <AnalysisCard
          title={group.pooled ? 'Flagged sales' : `Flagged sales in ${group.neighbourhood}`}
          labelId="flagged-title"
          description="A flagged sale is a question for the appraiser, not a verdict. Open a sale to keep it with a note or set it aside with a reason."
          aside={!group.pooled && group.fit && <span className="text-sm text-ink-soft"><span className="figures">{group.flagged.length}</span> of <span className="figures">{group.n}</span> sales</span>}
        >
          <FlaggedSales assignmentId={assignment.id} group={group} otherGroups={groups} format={format} lookup={lookup} onChooseGroup={choose} />
        </AnalysisCard>

        <AnalysisCard title="Set aside from the analysis" labelId="excluded-title" description="Excluded sales stay on record with the reason given.">
          <ExcludedSales assignmentId={assignment.id} excluded={analysis.excluded} />
        </AnalysisCard>
      </div>
    </div>
  );
}
