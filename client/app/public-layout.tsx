import { Outlet } from 'react-router-dom';
import { Wordmark } from '../components/ui/brand-mark';
import { LedgerIllustration } from '../components/ui/ledger-illustration';

/** The frame of the pages a signed-out visitor sees: sign in, password reset, invitation. */
export function PublicLayout() {
  return (
    <div className="grid min-h-dvh lg:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)]">
      <aside className="hidden flex-col justify-between border-r border-rule bg-paper-sunk/70 px-12 py-10 lg:flex">
        <Wordmark />
        <div className="max-w-xl">
          <p className="text-[2.125rem] leading-[1.15] font-semibold tracking-[-0.02em] text-ink">Sales comparison, measured.</p>
          <p className="mt-4 max-w-lg text-[1.0625rem] leading-relaxed text-ink-soft">
            Compline fits price against floor area in each neighbourhood, asks about the sales the fit cannot explain, and carries
            the measured rates into your adjustment grid. The statistics support your judgement; they never replace it.
          </p>
          <LedgerIllustration className="mt-10 w-full max-w-lg" />
        </div>
        <p className="text-sm text-ink-faint">For appraisers, review appraisers and lender clients.</p>
      </aside>

      <div className="flex flex-col px-6 py-8 sm:px-10">
        <header className="lg:hidden">
          <Wordmark />
          <p className="mt-3 text-ink-soft">Sales comparison, measured.</p>
        </header>
        <main className="flex flex-1 items-center justify-center py-10">
          <div className="w-full max-w-[26rem]">
            <Outlet />
          </div>
        </main>
        <LedgerIllustration className="mx-auto hidden w-full max-w-md opacity-80 md:block lg:hidden" />
      </div>
    </div>
  );
}
