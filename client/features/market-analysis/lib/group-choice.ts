import type { Analysis, GroupAnalysis, Trend } from '@contracts/analysis';

/** The search parameter that remembers the chosen neighbourhood (?neighbourhood=Orchard+Rise). */
export const GROUP_PARAM = 'neighbourhood';

/**
 * The groups in the order the switcher shows them: the subject's neighbourhood, the others, then
 * the pooled fit over all of them. The server already sends them so; this keeps the rule here too.
 */
export function orderedGroups(analysis: Analysis): GroupAnalysis[] {
  const subject = analysis.subjectGroup;
  const rank = (g: GroupAnalysis) => (g.pooled ? 2 : g.neighbourhood === subject ? 0 : 1);
  return [...analysis.groups].sort((a, b) => rank(a) - rank(b));
}

/** The group named in the address, else the subject's neighbourhood, else the first there is. */
export function chooseGroup(groups: readonly GroupAnalysis[], requested: string | null, subjectGroup: string | null): GroupAnalysis | undefined {
  return (
    groups.find((g) => g.neighbourhood === requested) ??
    groups.find((g) => g.neighbourhood === subjectGroup) ??
    groups[0]
  );
}

/** The market-conditions trend that belongs to a group (the pooled trend has the pooled name). */
export function trendOf(analysis: Analysis, group: GroupAnalysis): Trend | undefined {
  return analysis.trends.find((t) => t.neighbourhood === group.neighbourhood);
}
