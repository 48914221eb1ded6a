import type { ReactNode } from 'react';
import { SrmSwatch } from '@/components/srm-swatch';
import { ION_NAMES } from '@/lib/brewing/constants';
import type { HopUse } from '@/lib/brewing/schema';
import type { RecipeStats } from '@/lib/brewing/stats';
import { fitStyle, type RangeFit, type StyleFit, type StyleVital } from '@/lib/brewing/styles';
import { DISPLAY_UNITS, toDisplayUnits, type UnitSystem } from '@/lib/brewing/units';
import { MASH_PH_TARGET } from '@/lib/brewing/water';
import { ION_LABEL } from '@/lib/format';

/** Above this keg pressure most homebrew kegs and regulators are near their limits. */
const HIGH_KEG_PRESSURE_KPA = 200;

const HOP_USE_WORDS: Record<HopUse, string> = {
  mash: 'mash',
  first_wort: 'first wort',
  boil: 'boil',
  whirlpool: 'whirlpool',
  dry_hop: 'dry hop',
};

const VITAL_WORDS: Record<StyleVital, string> = { og: 'OG', fg: 'FG', abv: 'ABV', ibu: 'IBU', srm: 'SRM' };

const POSITION_LABEL = { below: 'below the range', within: 'within the range', above: 'above the range' } as const;

type GuideAnchor = 'og' | 'fg' | 'abv' | 'ibu' | 'colour' | 'water' | 'carbonation' | 'style-fit';

export interface StatsPanelProps {
  stats: RecipeStats;
  units: UnitSystem;
  /** Fit against this style instead of the one the stats were computed with. */
  styleCode?: string;
  /** Headline numbers only, on one line: for lists and small screens. */
  compact?: boolean;
}

function fixed(value: number, decimals: number): string {
  return value.toFixed(decimals);
}

function formatVital(vital: StyleVital, value: number): string {
  if (vital === 'og' || vital === 'fg') return fixed(value, 3);
  if (vital === 'ibu') return fixed(value, 0);
  return fixed(value, 1);
}

function formatTemperature(tempC: number, units: UnitSystem): string {
  const unit = DISPLAY_UNITS[units].temperature;
  return `${fixed(toDisplayUnits(tempC, 'temperature', units), 0)} °${unit}`;
}

function formatPressure(kPa: number, units: UnitSystem): string {
  return units === 'us' ? `${fixed(toDisplayUnits(kPa, 'pressure', units), 1)} psi` : `${fixed(kPa, 0)} kPa`;
}

/** Where the design guide explains a number the engine predicts. */
function DesignGuide({ anchor, about }: { anchor: 'mash-ph' | 'spunding'; about: string }) {
  return (
    <a href={`/guides/designing#${anchor}`} className="font-sans text-xs">
      how is this predicted?<span className="sr-only"> ({about})</span>
    </a>
  );
}

/** Predicted mash pH against the range pale beers aim for; old versions saved before the prediction have none. */
function mashPhExtra(ph: number): string {
  if (ph < MASH_PH_TARGET.min) return `predicted; below the usual ${MASH_PH_TARGET.min}–${MASH_PH_TARGET.max}`;
  if (ph > MASH_PH_TARGET.max) return `predicted; above the usual ${MASH_PH_TARGET.min}–${MASH_PH_TARGET.max}`;
  return `predicted, room temperature; within ${MASH_PH_TARGET.min}–${MASH_PH_TARGET.max}`;
}

function SpundingBlock({ spunding, units }: { spunding: NonNullable<RecipeStats['spunding']>; units: UnitSystem }) {
  const high = spunding.pressureKPa > HIGH_KEG_PRESSURE_KPA;
  return (
    <section className="mt-6" aria-labelledby="spunding-numbers-title">
      <h3 id="spunding-numbers-title" className="text-base font-semibold">
        Spunding
      </h3>
      <p className="kf-data mt-2 text-sm" data-testid="spunding-volumes">
        A valve at {formatPressure(spunding.pressureKPa, units)} with the beer at{' '}
        {formatTemperature(spunding.tempC, units)} leaves about{' '}
        <strong className="font-semibold">{fixed(spunding.volumesCO2, 2)} volumes CO₂</strong> in the beer.
      </p>
      {spunding.servingPressureKPa !== null && (
        <p className="kf-data mt-1 text-sm">
          {spunding.servingPressureKPa < 1
            ? 'Sealed and chilled to serving temperature, the cold beer holds all of that CO₂: the gauge reads nothing.'
            : `Sealed and chilled to serving temperature, the same CO₂ reads about ${formatPressure(spunding.servingPressureKPa, units)} on the gauge.`}
        </p>
      )}
      {spunding.pressureForTargetKPa !== null && (
        <p className="kf-data mt-1 text-sm">
          For the carbonation target, set the valve to about{' '}
          <strong className="font-semibold">{formatPressure(spunding.pressureForTargetKPa, units)}</strong> at{' '}
          {formatTemperature(spunding.tempC, units)}.
        </p>
      )}
      <p className={`mt-1 font-sans text-sm ${high ? 'font-semibold text-caution' : 'text-muted'}`}>
        Caution: seal only a vessel rated for pressure, keep its pressure-relief valve working, and never go past the
        vessel maker’s rated pressure{high ? '; this setting is higher than many homebrew vessels allow' : ''}.
      </p>
      <DesignGuide anchor="spunding" about="spunding" />
    </section>
  );
}

function HowComputed({ anchor, about }: { anchor: GuideAnchor; about: string }) {
  return (
    <a href={`/guides/numbers#${anchor}`} className="font-sans text-xs">
      how is this computed?<span className="sr-only"> ({about})</span>
    </a>
  );
}

function Figure({ term, value, extra, link }: { term: string; value: ReactNode; extra?: ReactNode; link?: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="font-sans text-xs font-semibold uppercase tracking-wide text-muted">{term}</dt>
      <dd className="kf-data text-xl font-semibold text-ink">{value}</dd>
      {extra && <dd className="kf-data text-xs text-muted">{extra}</dd>}
      {link && <dd>{link}</dd>}
    </div>
  );
}

function CompactStats({ stats }: { stats: RecipeStats }) {
  const items: [string, string][] = [
    ['OG', fixed(stats.og, 3)],
    ['FG', fixed(stats.fg, 3)],
    ['ABV', `${fixed(stats.abv, 1)}%`],
    ['IBU', fixed(stats.ibu, 0)],
  ];
  return (
    <dl className="kf-data flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
      {items.map(([term, value]) => (
        <div key={term} className="flex gap-1">
          <dt className="text-muted">{term}</dt>
          <dd className="font-semibold">{value}</dd>
        </div>
      ))}
      <div className="flex items-center gap-1">
        <dt className="text-muted">SRM</dt>
        <dd className="flex items-center gap-1 font-semibold">
          <SrmSwatch srm={stats.srm} size="sm" />
          {fixed(stats.srm, 1)}
        </dd>
      </div>
    </dl>
  );
}

function HopBitterness({ hops }: { hops: RecipeStats['hops'] }) {
  if (hops.length === 0) return <p className="mt-2 font-sans text-sm text-muted">No hops yet.</p>;
  return (
    <table className="mt-2 w-full font-sans text-sm">
      <caption className="sr-only">Bitterness from each hop addition</caption>
      <thead>
        <tr className="border-b border-line text-left text-xs text-muted">
          <th scope="col" className="py-1 font-semibold">
            Hop
          </th>
          <th scope="col" className="py-1 font-semibold">
            Use
          </th>
          <th scope="col" className="py-1 text-right font-semibold">
            IBU
          </th>
        </tr>
      </thead>
      <tbody>
        {hops.map((hop, index) => (
          <tr key={index} className="border-b border-line/60 last:border-0">
            <td className="py-1 pr-2">{hop.name}</td>
            <td className="py-1 pr-2 text-muted">{HOP_USE_WORDS[hop.use]}</td>
            <td className="kf-data py-1 text-right">{fixed(hop.ibu, 1)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function WaterBlock({ water, units }: { water: NonNullable<RecipeStats['water']>; units: UnitSystem }) {
  const unit = DISPLAY_UNITS[units].concentration;
  return (
    <section className="mt-6">
      <h3 className="text-base font-semibold">Water after salts</h3>
      <dl className="kf-data mt-2 grid grid-cols-2 gap-x-4 gap-y-1 text-sm @md:grid-cols-3">
        {ION_NAMES.map((ion) => (
          <div key={ion} className="flex justify-between gap-2 border-b border-line/60 py-0.5">
            <dt className="text-muted">{ION_LABEL[ion]}</dt>
            <dd className="whitespace-nowrap">
              {fixed(water[ion], 0)} {unit}
            </dd>
          </div>
        ))}
      </dl>
      <dl className="kf-data mt-3 space-y-1 text-sm">
        <div className="flex flex-wrap justify-between gap-2">
          <dt>Sulfate to chloride ratio</dt>
          <dd className="font-semibold">
            {Number.isFinite(water.sulfateToChloride) ? fixed(water.sulfateToChloride, 2) : 'no chloride'}
          </dd>
        </div>
        <div className="flex flex-wrap justify-between gap-2">
          <dt>Residual alkalinity</dt>
          <dd className="font-semibold">{fixed(water.residualAlkalinity, 0)} mg/L as CaCO₃</dd>
        </div>
      </dl>
      <HowComputed anchor="water" about="water" />
    </section>
  );
}

function CarbonationBlock({
  carbonation,
  units,
}: {
  carbonation: NonNullable<RecipeStats['carbonation']>;
  units: UnitSystem;
}) {
  const pressure =
    units === 'us' ? `${fixed(carbonation.kegPressurePsi, 1)} psi` : `${fixed(carbonation.kegPressureKPa, 0)} kPa`;
  const high = carbonation.kegPressureKPa > HIGH_KEG_PRESSURE_KPA;
  return (
    <section className="mt-6">
      <h3 className="text-base font-semibold">Carbonation</h3>
      <p className="kf-data mt-2 text-sm">
        {fixed(carbonation.volumesCO2, 1)} volumes CO₂ served at {formatTemperature(carbonation.servingTempC, units)}:
        set the keg to about <strong className="font-semibold">{pressure}</strong>.
      </p>
      {high && (
        <p className="mt-1 font-sans text-sm font-semibold text-caution">
          Caution: check your keg’s rated pressure; follow the equipment maker’s limits.
        </p>
      )}
      <HowComputed anchor="carbonation" about="carbonation" />
    </section>
  );
}

/** Where a value sits on a bar that shows the style band with some room either side. */
function barScale(fit: RangeFit): { bandLeft: number; bandWidth: number; marker: number } {
  const span = fit.max - fit.min || Math.abs(fit.max) * 0.1 || 1;
  const low = Math.min(fit.min - span / 2, fit.value);
  const high = Math.max(fit.max + span / 2, fit.value);
  const percent = (v: number) => ((v - low) / (high - low)) * 100;
  return { bandLeft: percent(fit.min), bandWidth: percent(fit.max) - percent(fit.min), marker: percent(fit.value) };
}

function RangeBar({ vital, fit }: { vital: StyleVital; fit: RangeFit | null }) {
  const term = VITAL_WORDS[vital];
  if (!fit) {
    return (
      <li className="font-sans text-sm">
        <span className="font-semibold">{term}</span> <span className="text-muted">— the guidelines give no range</span>
      </li>
    );
  }
  const { bandLeft, bandWidth, marker } = barScale(fit);
  const inside = fit.position === 'within';
  return (
    <li className="font-sans text-sm">
      <div className="flex flex-wrap justify-between gap-x-2">
        <span>
          <span className="font-semibold">{term}</span> <span className="kf-data">{formatVital(vital, fit.value)}</span>
        </span>
        <span className={inside ? 'text-bine' : 'font-semibold text-caution'}>
          {!inside && <span aria-hidden="true">⚠ </span>}
          {POSITION_LABEL[fit.position]}
        </span>
      </div>
      <div className="relative mt-1 h-3" aria-hidden="true">
        <div className="absolute inset-x-0 top-1 h-1 rounded bg-line" />
        <div
          className="absolute top-0 h-3 rounded bg-bine/40"
          style={{ left: `${bandLeft}%`, width: `${bandWidth}%` }}
        />
        <div
          className={`absolute -top-0.5 h-4 w-1 -translate-x-1/2 rounded ${inside ? 'bg-ink' : 'bg-caution'}`}
          style={{ left: `${marker}%` }}
        />
      </div>
      <p className="kf-data text-xs text-muted">
        style range {formatVital(vital, fit.min)}–{formatVital(vital, fit.max)}
      </p>
    </li>
  );
}

function StyleFitBlock({ fit }: { fit: StyleFit }) {
  return (
    <section className="mt-6">
      <h3 className="text-base font-semibold">
        Fit to style: {fit.code} {fit.name}
      </h3>
      <ul className="mt-2 space-y-3">
        {(['og', 'fg', 'abv', 'ibu', 'srm'] as const).map((vital) => (
          <RangeBar key={vital} vital={vital} fit={fit[vital]} />
        ))}
      </ul>
      <HowComputed anchor="style-fit" about="style fit" />
    </section>
  );
}

function styleFitFor(stats: RecipeStats, styleCode?: string): StyleFit | null {
  if (!styleCode || stats.styleFit?.code === styleCode) return stats.styleFit;
  return fitStyle(styleCode, { og: stats.og, fg: stats.fg, abv: stats.abv, ibu: stats.ibu, srm: stats.srm });
}

/** A recipe's computed numbers. Renders on the server or the client (no hooks). */
export function StatsPanel({ stats, units, styleCode, compact = false }: StatsPanelProps) {
  if (compact) return <CompactStats stats={stats} />;
  const styleFit = styleFitFor(stats, styleCode);
  // Versions saved before the engine predicted mash pH carry no mash numbers.
  const mashPh = (stats.mash as RecipeStats['mash'] | undefined)?.predictedPh ?? null;
  return (
    <div className="@container">
      <dl className="grid grid-cols-2 gap-x-4 gap-y-4 @xl:grid-cols-3">
        <Figure
          term="OG"
          value={fixed(stats.og, 3)}
          extra={`${fixed(stats.plato, 1)} °Plato`}
          link={<HowComputed anchor="og" about="OG" />}
        />
        <Figure
          term="FG"
          value={fixed(stats.fg, 3)}
          extra={`${fixed(stats.attenuationPct, 0)}% apparent attenuation`}
          link={<HowComputed anchor="fg" about="FG" />}
        />
        <Figure
          term="ABV"
          value={`${fixed(stats.abv, 1)}%`}
          extra={`${fixed(stats.abvAlternate, 1)}% by the alternate formula`}
          link={<HowComputed anchor="abv" about="ABV" />}
        />
        <Figure
          term="IBU"
          value={fixed(stats.ibu, 0)}
          extra={`BU:GU ${fixed(stats.buGu, 2)}`}
          link={<HowComputed anchor="ibu" about="IBU" />}
        />
        <Figure
          term="Colour"
          value={
            <span className="flex items-center gap-2">
              <SrmSwatch srm={stats.srm} />
              {fixed(stats.srm, 1)} SRM
            </span>
          }
          extra={`${fixed(stats.ebc, 0)} EBC`}
          link={<HowComputed anchor="colour" about="colour" />}
        />
        <Figure term="Calories" value={fixed(stats.caloriesPer355mL, 0)} extra="kcal per 355 mL (12 US fl oz)" />
        {mashPh !== null && (
          <Figure
            term="Mash pH"
            value={<span data-testid="predicted-mash-ph">{fixed(mashPh, 2)}</span>}
            extra={mashPhExtra(mashPh)}
            link={<DesignGuide anchor="mash-ph" about="mash pH" />}
          />
        )}
      </dl>
      <section className="mt-6">
        <h3 className="text-base font-semibold">Bitterness by hop</h3>
        <HopBitterness hops={stats.hops} />
      </section>
      {stats.water && <WaterBlock water={stats.water} units={units} />}
      {stats.carbonation && <CarbonationBlock carbonation={stats.carbonation} units={units} />}
      {stats.spunding && <SpundingBlock spunding={stats.spunding} units={units} />}
      {styleFit && <StyleFitBlock fit={styleFit} />}
    </div>
  );
}
