import type { Reconsideration } from '@contracts/reconsiderations';
import type { EffectFormat } from '../lib/effect-format';

type Effect = NonNullable<Reconsideration['effect']>;

/** The subject neighbourhood's fit as signed beside the same fit with the client's extra sales. */
export function EffectTable({ effect, format }: { effect: Effect; format: EffectFormat }) {
  const { before, withExtra } = effect;
  const rows: Array<[string, string, string, string]> = [
    ['Sales in the fit (n)', format.count(before.n), format.count(withExtra.n), format.change(before.n, withExtra.n, (v) => format.count(v))],
    ['Slope', format.perArea(before.slope), format.perArea(withExtra.slope), format.change(before.slope, withExtra.slope, (v) => format.money(v))],
    ['R²', format.r2(before.rSquared), format.r2(withExtra.rSquared), format.change(before.rSquared, withExtra.rSquared, (v) => format.r2(v))],
    ['Estimate at the subject', format.money(before.estimate), format.money(withExtra.estimate), format.change(before.estimate, withExtra.estimate, (v) => format.money(v))],
  ];
  return (
    <div className="overflow-x-auto rounded-md border border-rule">
      <table className="w-full border-collapse text-[0.875rem]">
        <caption className="bg-paper-sunk/60 px-3 py-2 text-left text-[0.8125rem] font-semibold text-ink-soft">Effect on the {effect.neighbourhood} fit</caption>
        <thead>
          <tr className="text-left text-[0.75rem] tracking-wide text-ink-faint uppercase">
            <th scope="col" className="px-3 py-1.5 font-semibold" />
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">As signed</th>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">With the extra sales</th>
            <th scope="col" className="px-3 py-1.5 text-right font-semibold">Change</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, a, b, d]) => (
            <tr key={label} className="border-t border-rule">
              <th scope="row" className="px-3 py-1.5 text-left font-normal text-ink-soft">
                {label}
              </th>
              <td className="figures px-3 py-1.5 text-right whitespace-nowrap text-ink">{a}</td>
              <td className="figures px-3 py-1.5 text-right font-semibold whitespace-nowrap text-ink">{b}</td>
              <td className="figures px-3 py-1.5 text-right whitespace-nowrap text-ink-soft">{d}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
