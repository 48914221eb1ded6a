import { differenceInCalendarDays, format, parseISO } from 'date-fns';
import type { Metadata } from 'next';
import Link from 'next/link';
import { Markdown } from '@/components/markdown';
import { Caution, CAUTIONS } from '@/components/brew-days/caution';
import { FermentationChart, type ChartPoint } from '@/components/brew-days/fermentation-chart';
import { PlanPanel } from '@/components/brew-days/plan-panel';
import { PhotoGallery } from '@/components/brew-days/photo-gallery';
import { PhotoUploader } from '@/components/brew-days/photo-uploader';
import { ReadingForm } from '@/components/brew-days/reading-form';
import { TastingForm } from '@/components/brew-days/tasting-form';
import type { BrewDayView } from '@/lib/brew-days/brew-days';
import { loadBrewDayPage } from '@/lib/brew-days/pages';
import type { Comparison } from '@/lib/brew-days/measure';
import { TYPICAL_KEG_RATING_KPA } from '@/lib/brew-days/schemas';
import { toDisplayUnits, type UnitSystem } from '@/lib/brewing/units';
import { formatAmount } from '@/lib/format';
import { MAX_PHOTO_BYTES } from '@/lib/storage/images';

type Props = { params: Promise<{ id: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { view } = await loadBrewDayPage((await params).id);
  return {
    title: `${view.recipe.title}: brewed ${format(parseISO(view.day.brewedOn), 'd MMM yyyy')} by ${view.brewer.name}`,
  };
}

function pressureText(kPa: number, units: UnitSystem): string {
  return `${toDisplayUnits(kPa, 'pressure', units).toFixed(0)} ${units === 'us' ? 'psi' : 'kPa'}`;
}

function shown(value: number | null, c: Comparison, units: UnitSystem, signed = false): string {
  if (value === null) return '—';
  const sign = signed && value > 0 ? '+' : '';
  switch (c.quantity) {
    case 'gravity':
      return signed ? `${sign}${Math.round(value * 1000)} pts` : value.toFixed(3);
    case 'percent':
      return `${sign}${value.toFixed(1)}${signed ? ' pts' : '%'}`;
    case 'ph':
      return `${sign}${value.toFixed(2)}`;
    case 'temperature':
      // A difference converts by scale only (no offset).
      return signed
        ? `${sign}${(units === 'us' ? value * 1.8 : value).toFixed(1)} ${units === 'us' ? '°F' : '°C'}`
        : formatAmount(value, 'temperature', units);
    case 'volume':
      return `${sign}${formatAmount(value, 'volume', units, 1)}`;
    case 'pressure':
      return `${sign}${pressureText(value, units)}`;
  }
}

function ComparisonTable({ view, units }: { view: BrewDayView; units: UnitSystem }) {
  const rows = view.outcome.comparisons.filter(
    (c) =>
      c.measured !== null ||
      ['og', 'fg', 'efficiencyPct', 'abv'].includes(c.key) ||
      (c.key === 'mashPh' && c.predicted !== null),
  );
  return (
    <table className="w-full font-sans text-sm">
      <caption className="sr-only">Measured numbers beside the version&apos;s prediction</caption>
      <thead>
        <tr className="border-b border-line text-left text-muted">
          <th scope="col" className="py-1 pr-2 font-normal">
            <span className="sr-only">Number</span>
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-normal">
            Measured
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-normal">
            Predicted
          </th>
          <th scope="col" className="py-1 text-right font-normal">
            Difference
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((c) => (
          <tr key={c.key} className="border-b border-line/60">
            <th scope="row" className="py-1 pr-2 text-left font-normal">
              {c.label}
            </th>
            <td className="kf-data py-1 pr-2 text-right">{shown(c.measured, c, units)}</td>
            <td className="kf-data py-1 pr-2 text-right text-muted">{shown(c.predicted, c, units)}</td>
            <td className="kf-data py-1 text-right">
              {c.difference === null ? '—' : shown(c.difference, c, units, true)}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function chartPoints(view: BrewDayView, units: UnitSystem): ChartPoint[] {
  const start = parseISO(view.day.brewedOn);
  const temp = (c: number | null) => (c === null ? null : toDisplayUnits(c, 'temperature', units));
  const points: ChartPoint[] = [];
  if (view.day.og !== null) points.push({ day: 0, gravity: view.day.og, temp: temp(view.day.pitchTempC) });
  for (const r of view.readings)
    points.push({
      day: differenceInCalendarDays(parseISO(r.takenOn), start),
      gravity: r.gravity,
      temp: temp(r.beerTempC),
    });
  return points;
}

function readingText(r: BrewDayView['readings'][number], units: UnitSystem): string {
  const parts: string[] = [];
  if (r.gravity !== null) {
    const raw =
      r.method === 'refractometer'
        ? `${r.rawValue} °Brix`
        : r.sampleTempC !== null
          ? `read ${r.rawValue?.toFixed(3)} at ${formatAmount(r.sampleTempC, 'temperature', units)}`
          : null;
    parts.push(`${r.gravity.toFixed(3)}${raw ? ` (${raw})` : ''}`);
  }
  if (r.beerTempC !== null) parts.push(formatAmount(r.beerTempC, 'temperature', units));
  return parts.join(' · ');
}

export default async function BrewDayPage({ params }: Props) {
  const { viewer, view } = await loadBrewDayPage((await params).id);
  const units: UnitSystem = viewer?.units ?? 'metric';
  const { day, outcome, version } = view;
  const points = chartPoints(view, units);
  const kegHigh = outcome.kegPressureAboveTypicalRating;
  return (
    <article className="space-y-8">
      <header>
        <p className="font-sans text-sm text-muted">
          <Link href={`/recipes/${view.recipe.slug}/v/${version.number}`}>
            {view.recipe.title}, version {version.number}
          </Link>
        </p>
        <h1 className="text-3xl font-semibold">Brewed {format(parseISO(day.brewedOn), 'd MMMM yyyy')}</h1>
        <p className="font-sans text-sm text-muted">
          by <Link href={`/members/${view.brewer.handle}`}>{view.brewer.name}</Link>
          {day.packagedOn && (
            <>
              {' '}
              · packaged {format(parseISO(day.packagedOn), 'd MMM yyyy')} in{' '}
              {day.packaging === 'keg' ? 'a keg' : day.packaging === 'bottles' ? 'bottles' : '—'}
              {day.packaging === 'keg' && day.kegPressureKPa !== null && (
                <> at {pressureText(day.kegPressureKPa, units)}</>
              )}
              {day.packaging === 'bottles' && day.primingSugarG !== null && (
                <> with {formatAmount(day.primingSugarG, 'hopMass', units, 1)} priming sugar</>
              )}
            </>
          )}
        </p>
        {view.canEdit && (
          <p className="mt-2 flex flex-wrap gap-2 font-sans text-sm">
            <Link href={`/brew-days/${day.id}/live`} className="kf-btn inline-block">
              Brew-day mode
            </Link>
            <Link href={`/brew-days/${day.id}/edit`} className="kf-btn-quiet inline-block">
              Edit brew day
            </Link>
          </p>
        )}
      </header>

      {kegHigh && (
        <p role="alert" className="rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger">
          The keg pressure recorded is above a typical keg rating of {TYPICAL_KEG_RATING_KPA} kPa (30 psi), by common
          practice. Keep within the keg and regulator makers&apos; stated limits and your local codes.{' '}
          <Link href="/guides/safety">Safety guide</Link>
        </p>
      )}

      <div className="grid gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <section aria-labelledby="measured-title">
          <h2 id="measured-title" className="text-xl font-semibold">
            Measured against predicted
          </h2>
          <ComparisonTable view={view} units={units} />
          <dl className="mt-4 grid grid-cols-3 gap-3 font-sans text-sm">
            <div className="kf-card">
              <dt className="text-muted">Efficiency</dt>
              <dd className="kf-data text-lg">
                {outcome.efficiencyPct === null ? '—' : `${outcome.efficiencyPct.toFixed(1)}%`}
              </dd>
            </div>
            <div className="kf-card">
              <dt className="text-muted">Attenuation</dt>
              <dd className="kf-data text-lg">
                {outcome.attenuationPct === null ? '—' : `${outcome.attenuationPct.toFixed(1)}%`}
              </dd>
            </div>
            <div className="kf-card">
              <dt className="text-muted">ABV</dt>
              <dd className="kf-data text-lg">{outcome.abv === null ? '—' : `${outcome.abv.toFixed(1)}%`}</dd>
            </div>
          </dl>
          <p className="mt-2 font-sans text-xs text-muted">
            Efficiency uses the measured OG and the volume into the fermenter
            {day.fermenterVolumeL === null ? ' (not recorded, so the recipe’s batch volume)' : ''}.
          </p>
        </section>
        <aside className="space-y-3">
          <h2 className="text-xl font-semibold">On the day</h2>
          <dl className="grid grid-cols-2 gap-x-4 gap-y-1 font-sans text-sm">
            <dt className="text-muted">Strike water</dt>
            <dd className="kf-data">
              {day.strikeTempC === null ? '—' : formatAmount(day.strikeTempC, 'temperature', units)}
            </dd>
            <dt className="text-muted">Pitching</dt>
            <dd className="kf-data">
              {day.pitchTempC === null ? '—' : formatAmount(day.pitchTempC, 'temperature', units)}
            </dd>
          </dl>
          <Caution>{CAUTIONS.hotLiquor}</Caution>
          <Caution>{day.packaging === 'bottles' ? CAUTIONS.bottles : CAUTIONS.pressure}</Caution>
        </aside>
      </div>

      {view.canEdit && (
        <PlanPanel brewDayId={day.id} brewedOn={day.brewedOn} document={view.version.document} saved={day.plan} />
      )}

      <section aria-labelledby="fermentation-title">
        <h2 id="fermentation-title" className="text-xl font-semibold">
          Fermentation
        </h2>
        {points.length >= 2 ? (
          <FermentationChart points={points} predictedFg={version.stats.fg} tempLabel={units === 'us' ? '°F' : '°C'} />
        ) : (
          <p className="font-sans text-sm text-muted">The chart appears once there is an OG and a reading.</p>
        )}
        {view.readings.length > 0 && (
          <ol className="mt-3 space-y-1 font-sans text-sm">
            {view.readings.map((r) => (
              <li key={r.id}>
                <span className="text-muted">
                  Day {differenceInCalendarDays(parseISO(r.takenOn), parseISO(day.brewedOn))}:
                </span>{' '}
                {readingText(r, units)}
                {r.note && <span className="text-muted"> · {r.note}</span>}
              </li>
            ))}
          </ol>
        )}
        {view.canEdit && (
          <div className="mt-4">
            <ReadingForm brewDayId={day.id} units={units} brewedOn={day.brewedOn} />
          </div>
        )}
      </section>

      {day.notes && (
        <section aria-labelledby="notes-title">
          <h2 id="notes-title" className="text-xl font-semibold">
            Notes
          </h2>
          <Markdown source={day.notes} />
        </section>
      )}

      <section aria-labelledby="photos-title" className="space-y-3">
        <h2 id="photos-title" className="text-xl font-semibold">
          Photos
        </h2>
        <PhotoGallery photos={view.photos} canDelete={view.canModeratePhotos} />
        {view.canEdit && <PhotoUploader brewDayId={day.id} maxMb={MAX_PHOTO_BYTES / 1024 / 1024} />}
      </section>

      <section aria-labelledby="tastings-title" className="space-y-3">
        <h2 id="tastings-title" className="text-xl font-semibold">
          Tastings
        </h2>
        {view.tastings.length === 0 && <p className="font-sans text-sm text-muted">No tastings yet.</p>}
        {view.tastings.map((t) => (
          <article key={t.id} className="kf-card">
            <p className="font-sans text-sm">
              <Link href={`/members/${t.tasterHandle}`}>{t.tasterName}</Link> ·{' '}
              {format(parseISO(t.tastedOn), 'd MMM yyyy')} · <span className="font-semibold">{t.rating} of 5</span>
            </p>
            <dl className="mt-1 grid gap-x-4 font-sans text-sm sm:grid-cols-[8rem_1fr]">
              {(['appearance', 'aroma', 'flavour', 'mouthfeel', 'overall'] as const).map((k) =>
                t[k] ? (
                  <div key={k} className="contents">
                    <dt className="capitalize text-muted">{k}</dt>
                    <dd>{t[k]}</dd>
                  </div>
                ) : null,
              )}
            </dl>
          </article>
        ))}
        {viewer ? (
          <TastingForm brewDayId={day.id} />
        ) : (
          <p className="font-sans text-sm">
            <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`/brew-days/${day.id}`)}`}>Sign in</Link> to add your
            tasting.
          </p>
        )}
      </section>
    </article>
  );
}
