import type { BrewhouseCalibration, WeightedFigure } from '@/lib/brew-days/calibration';
import { plural } from '@/lib/recipes/fields';

const YEAST_WORDS: Record<string, string> = {
  ale: 'Ale yeast',
  lager: 'Lager yeast',
  kveik: 'Kveik',
  wheat: 'Wheat-beer yeast',
  wild: 'Wild yeast',
  other: 'Other yeast',
};

function Figure({ figure }: { figure: WeightedFigure }) {
  return (
    <dd className="kf-data">
      {figure.weightedMeanPct.toFixed(1)}% <span className="text-muted">± {figure.spreadPct.toFixed(1)}</span>{' '}
      <span className="text-muted">
        over {plural(figure.count, 'brew')} ({figure.minPct.toFixed(0)}–{figure.maxPct.toFixed(0)}%)
      </span>
    </dd>
  );
}

/**
 * A brewer's measured brewhouse: recency-weighted brewhouse efficiency and apparent attenuation per
 * yeast kind, each with its spread. A figure needs two brews; one brew says nothing yet.
 */
export function BrewerAveragesPanel({ averages }: { averages: BrewhouseCalibration }) {
  const { calibration } = averages;
  const nothing = !calibration.efficiency && calibration.attenuationByYeastKind.length === 0;
  return (
    <section aria-labelledby="averages-title" className="kf-card">
      <h2 id="averages-title" className="text-lg font-semibold">
        Your brewhouse, measured
      </h2>
      {nothing ? (
        <p className="mt-1 font-sans text-sm text-muted">
          Record the OG (and later the FG) on at least {calibration.minBrews} brew days to see your own efficiency and
          attenuation here. One brew alone says too little to plan by.
        </p>
      ) : (
        <>
          <dl className="mt-2 grid gap-x-6 gap-y-1 font-sans text-sm sm:grid-cols-[auto_1fr]">
            {calibration.efficiency && (
              <>
                <dt className="text-muted">Brewhouse efficiency</dt>
                <Figure figure={calibration.efficiency} />
              </>
            )}
            {calibration.attenuationByYeastKind.map((a) => (
              <div key={a.yeastKind} className="contents">
                <dt className="text-muted">Attenuation, {YEAST_WORDS[a.yeastKind] ?? a.yeastKind}</dt>
                <Figure figure={a} />
              </div>
            ))}
          </dl>
          <p className="mt-2 font-sans text-xs text-muted">
            Recent brews count most: each older brew counts {Math.round(calibration.recencyDecay * 100)}% as much as the
            one after it. ± is the spread between brews.
          </p>
        </>
      )}
    </section>
  );
}
