import type { Analysis, FitSummary, GroupAnalysis } from '@contracts/analysis';
import type { FigureFormat } from '../lib/figure-format';
import { FigureHeading, FigureList, type FigureRow } from './figure-list';
import { GateVerdict, WarningList } from './fit-verdict';

interface Props {
  analysis: Analysis;
  group: GroupAnalysis & { fit: FitSummary };
  format: FigureFormat;
}

function interval(lo: number, hi: number, show: (v: number) => string): string {
  return `${show(lo)} to ${show(hi)}`;
}

/** The figures of the chosen fit, the estimate at the subject, the correlation check and the warnings. */
export function FitFigures({ analysis, group, format }: Props) {
  const { fit, prediction, gate } = group;
  const line: FigureRow[] = [
    { name: 'n', label: 'Sales in the fit (n)', value: format.count(fit.n) },
    {
      name: 'slope',
      label: `Slope, per ${format.unit}`,
      value: format.rateAmount(fit.slope),
      detail: <span className="figures">95%: {interval(fit.slopeInterval[0], fit.slopeInterval[1], format.rateAmount)}</span>,
    },
    { name: 'intercept', label: 'Intercept', value: format.money(fit.intercept) },
    { name: 'r', label: 'Correlation (r)', value: fit.r === null ? 'not defined: no spread in price' : format.ratio(fit.r) },
    { name: 'r-squared', label: 'R²', value: fit.rSquared === null ? 'not defined' : format.ratio(fit.rSquared) },
    { name: 'adjusted-r-squared', label: 'Adjusted R²', value: fit.adjustedRSquared === null ? 'not defined' : format.ratio(fit.adjustedRSquared) },
    { name: 'residual-standard-error', label: 'Residual standard error (s)', value: format.money(fit.residualStdError) },
    { name: 'slope-p-value', label: 'p-value of the slope', value: fit.slopePValue === null ? 'not defined' : format.pValue(fit.slopePValue) },
  ];

  const warnings = [...group.warnings.filter((w) => w !== gate?.message), ...analysis.warnings];

  return (
    <div className="flex flex-col">
      <FigureHeading>The line</FigureHeading>
      <FigureList label="Figures of the fitted line" rows={line} />

      <FigureHeading>At the subject</FigureHeading>
      {prediction ? (
        <FigureList
          label="Estimate at the subject"
          rows={[
            { name: 'estimate', label: `Estimate at ${format.area(prediction.x0)}`, value: format.money(prediction.estimate) },
            { name: 'prediction-interval', label: '95% prediction interval (one sale)', value: interval(prediction.lower, prediction.upper, format.money), stacked: true },
            { name: 'mean-interval', label: '95% confidence interval of the mean', value: interval(prediction.meanLower, prediction.meanUpper, format.money), stacked: true },
          ]}
        />
      ) : (
        <p className="py-1.5 text-[0.875rem] text-ink-soft">{noEstimateWords(analysis, group)}</p>
      )}
      {prediction?.extrapolated && (
        <p className="mt-1 text-[0.8125rem] text-rust">The subject’s floor area lies outside the sales’ range: the estimate extrapolates.</p>
      )}

      {gate && <GateVerdict gate={gate} />}
      <WarningList warnings={warnings} />
    </div>
  );
}

function noEstimateWords(analysis: Analysis, group: GroupAnalysis): string {
  if (analysis.subject.floorArea === null) return 'Enter the subject’s floor area to get an estimate at the subject.';
  if (analysis.subjectGroup && analysis.subjectGroup !== group.neighbourhood) {
    return `The subject lies in ${analysis.subjectGroup}: its estimate comes from that neighbourhood’s fit and from the pooled fit.`;
  }
  return 'No estimate at the subject from this fit.';
}
