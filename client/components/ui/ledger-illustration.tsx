/** A drawing for the sign-in page: sales on ledger paper, the line fitted through them, its band,
 * and one sale ringed as a question for the appraiser. Decoration only; it carries no figures. */
const SALES: ReadonlyArray<readonly [number, number]> = [
  [74, 233.6], [92, 234.5], [108, 219.6], [121, 213.2], [140, 198.4], [158, 198.7], [171, 207.8],
  [189, 192.7], [205, 192.7], [226, 175.2], [241, 170.4], [262, 159.3], [279, 131.8], [301, 150.2],
  [318, 139.3], [337, 131.2], [356, 99.1], [379, 88.8], [398, 90.2], [417, 86.8],
];
const FLAGGED: readonly [number, number] = [292, 204];
const BAND =
  'M56 210.9 L94 197.9 L132 184.4 L170 170.3 L208 155.6 L246 140 L284 123.6 L322 106.3 L360 88.4 L398 69.9 L436 50.9 ' +
  'L436 117.1 L398 130.1 L360 143.6 L322 157.7 L284 172.4 L246 188 L208 204.4 L170 221.7 L132 239.6 L94 258.1 L56 277.1 Z';

export function LedgerIllustration({ className = '' }: { className?: string }) {
  const rules = Array.from({ length: 12 }, (_, i) => 24 + i * 24);
  return (
    <svg viewBox="0 0 480 316" role="img" aria-label="Sales plotted by floor area and price, with a fitted line and one sale ringed for review" className={className}>
      {rules.map((y) => (
        <line key={y} x1="0" x2="480" y1={y} y2={y} stroke="var(--color-rule)" strokeWidth="1" />
      ))}
      <line x1="28" x2="28" y1="0" y2="316" stroke="var(--color-rust)" strokeOpacity="0.35" strokeWidth="1" />
      <path d={BAND} fill="var(--color-residual-low-soft)" fillOpacity="0.35" />
      <line x1="56" y1="244" x2="436" y2="84" stroke="var(--color-ink)" strokeWidth="2" strokeLinecap="round" />
      <path d="M40 16 V284 H464" fill="none" stroke="var(--color-ink-faint)" strokeWidth="1.25" />
      {SALES.map(([x, y]) => (
        <circle key={`${x}-${y}`} cx={x} cy={y} r="4.25" fill="var(--color-ink-soft)" stroke="var(--color-paper)" strokeWidth="1.5" />
      ))}
      <circle cx={FLAGGED[0]} cy={FLAGGED[1]} r="4.25" fill="var(--color-ink-soft)" stroke="var(--color-paper)" strokeWidth="1.5" />
      <circle cx={FLAGGED[0]} cy={FLAGGED[1]} r="10.5" fill="none" stroke="var(--color-flag-ring)" strokeWidth="2.25" />
      <text x="48" y="30" className="font-mono" fontSize="11" fill="var(--color-ink-soft)">
        price
      </text>
      <text x="460" y="302" textAnchor="end" className="font-mono" fontSize="11" fill="var(--color-ink-soft)">
        floor area
      </text>
    </svg>
  );
}
