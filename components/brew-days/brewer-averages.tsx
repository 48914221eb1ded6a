import type { BrewerAverages } from '@/lib/brew-days/brew-days';
import { plural } from '@/lib/recipes/fields';

const YEAST_WORDS: Record<string, string> = {
  ale: 'Ale yeast',
  lager: 'Lager yeast',
  kveik: 'Kveik',
  wheat: 'Wheat-beer yeast',
  wild: 'Wild yeast',
  other: 'Other yeast',
};

/** A brewer's measured system: mean brewhouse efficiency and apparent attenuation per yeast kind. */
export function BrewerAveragesPanel({ averages }: { averages: BrewerAverages }) {
  return (
    <section aria-labelledby="averages-title" className="kf-card">
      <h2 id="averages-title" className="text-lg font-semibold">
        Your system, measured
      </h2>
      {!averages.efficiency && averages.attenuationByYeastKind.length === 0 ? (
        <p className="mt-1 font-sans text-sm text-muted">
          Record an OG (and later an FG) on your brew days to see your own efficiency and attenuation here.
        </p>
      ) : (
        <dl className="mt-2 grid gap-x-6 gap-y-1 font-sans text-sm sm:grid-cols-2">
          {averages.efficiency && (
            <>
              <dt className="text-muted">Brewhouse efficiency</dt>
              <dd className="kf-data">
                {averages.efficiency.meanPct.toFixed(1)}%{' '}
                <span className="text-muted">over {plural(averages.efficiency.count, 'brew')}</span>
              </dd>
            </>
          )}
          {averages.attenuationByYeastKind.map((a) => (
            <div key={a.yeastKind} className="contents">
              <dt className="text-muted">Attenuation, {YEAST_WORDS[a.yeastKind] ?? a.yeastKind}</dt>
              <dd className="kf-data">
                {a.meanPct.toFixed(1)}% <span className="text-muted">over {plural(a.count, 'brew')}</span>
              </dd>
            </div>
          ))}
        </dl>
      )}
    </section>
  );
}
