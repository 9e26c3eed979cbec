import { mulberry32 } from '../../db/seed/random';
import type { AnalysisSale } from '../../server/analysis/market-analysis';

/** 50,000 invented sales over 200 neighbourhoods, each with its own level, rate and trend. */
export function benchmarkSales(total = 50_000, neighbourhoods = 200, seed = 8): AnalysisSale[] {
  const rand = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
  const out: AnalysisSale[] = [];
  for (let i = 0; i < total; i++) {
    const g = i % neighbourhoods;
    const area = 900 + rand() * 2200;
    const months = rand() * 18;
    const price = (40_000 + g * 900 + (150 + g) * area) * (1 - 0.004 * months) + normal() * 18_000;
    const day = new Date(Date.UTC(2026, 10, 15) - months * 30.44 * 86_400_000).toISOString().slice(0, 10);
    out.push({ id: i + 1, address: `${i + 1} Bench Street`, neighbourhood: `N${g}`, salePrice: Math.round(price), saleDate: day, floorArea: Math.round(area), saleType: 'arms_length', excluded: false, exclusionReason: null, inGrid: false });
  }
  return out;
}
