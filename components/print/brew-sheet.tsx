import type { ReactNode } from 'react';
import { Markdown } from '@/components/markdown';
import {
  mashAndSpargeVolumes,
  preBoilGravity,
  strikeWaterTempC,
  type Hop,
  type RecipeDocument,
  type RecipeStats,
  type UnitSystem,
} from '@/lib/brewing';
import { HOP_USE_LABEL, SALT_LABEL, formatAmount, formatGravity } from '@/lib/format';
import { ColumnHeads } from '@/components/column-heads';

/** Grain temperature the strike temperature is worked out for; the sheet says so beside it. */
const GRAIN_TEMP_C = 20;

/** Order of a brew day: mash hops, first wort, the boil from its longest addition down, the hop stand, then dry hops. */
const USE_ORDER: Record<Hop['use'], number> = { mash: 0, first_wort: 1, boil: 2, whirlpool: 3, dry_hop: 4 };

function hopChecklist(hops: readonly Hop[]): Hop[] {
  return [...hops].sort(
    (a, b) =>
      USE_ORDER[a.use] - USE_ORDER[b.use] || (a.use === 'dry_hop' ? a.timeMin - b.timeMin : b.timeMin - a.timeMin),
  );
}

function hopWhen(hop: Hop, units: UnitSystem): string {
  switch (hop.use) {
    case 'mash':
      return 'in the mash';
    case 'first_wort':
      return 'as the wort runs into the kettle';
    case 'boil':
      return hop.timeMin === 0 ? 'at flame-out' : `${hop.timeMin} min before the end of the boil`;
    case 'whirlpool':
      return `hop stand, ${hop.timeMin} min${hop.tempC === undefined ? '' : ` at ${formatAmount(hop.tempC, 'temperature', units)}`}`;
    case 'dry_hop':
      return `dry hop for ${+(hop.timeMin / 1440).toFixed(1)} days`;
  }
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="mt-6">
      <h2 className="text-lg font-semibold">{title}</h2>
      <div className="mt-2 font-sans text-sm">{children}</div>
    </section>
  );
}

function Tick({ label }: { label: string }) {
  return <input type="checkbox" className="kf-tick" aria-label={label} />;
}

/** A one- or two-page sheet to brew from: what to weigh, when to add it, and room to write what happened. */
export function BrewSheet({
  doc,
  stats,
  units,
  owner,
  number,
}: {
  doc: RecipeDocument;
  stats: RecipeStats;
  units: UnitSystem;
  owner: string;
  number: number;
}) {
  const volumes = mashAndSpargeVolumes(doc);
  const firstRest = doc.mash.steps[0];
  const strikeC = firstRest ? strikeWaterTempC(firstRest.tempC, GRAIN_TEMP_C, doc.batch.mashWaterLPerKg) : null;
  const totalKg = doc.fermentables.reduce((n, f) => n + f.amountKg, 0);
  const volume = (litres: number) => formatAmount(litres, 'volume', units, 1);
  const temp = (c: number) => formatAmount(c, 'temperature', units);
  // Versions saved before the engine predicted mash pH carry no mash numbers.
  const predictedPh = (stats.mash as RecipeStats['mash'] | undefined)?.predictedPh ?? null;
  const spunding = stats.spunding as RecipeStats['spunding'] | undefined;
  const pressure = (kPa: number) => formatAmount(kPa, 'pressure', units, units === 'us' ? 1 : 0);
  const measured: [string, string][] = [
    ['Strike water temperature', strikeC === null ? '—' : `${temp(strikeC)} (grain at ${temp(GRAIN_TEMP_C)})`],
    [
      'Mash pH (room temperature)',
      predictedPh === null ? '5.2–5.6' : `${predictedPh.toFixed(2)} predicted (aim 5.2–5.6)`,
    ],
    ['Pre-boil volume', volume(volumes.preBoilVolumeL)],
    ['Pre-boil gravity', formatGravity(preBoilGravity(stats.og, doc.batch))],
    ['Original gravity (OG)', formatGravity(stats.og)],
    ['Volume into the fermenter', volume(doc.batch.volumeL)],
    ['Final gravity (FG)', formatGravity(stats.fg)],
    ['Volume packaged', ''],
  ];
  return (
    <article className="kf-sheet">
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 className="text-2xl font-semibold">{doc.title}</h1>
          <p className="mt-1 font-sans text-sm text-muted">
            Version {number} by {owner}
            {doc.style && ` · ${doc.style.code} ${doc.style.name}`} · {volume(doc.batch.volumeL)} into the fermenter ·{' '}
            {doc.batch.boilTimeMin} min boil · {doc.batch.efficiencyPct}% efficiency
          </p>
        </div>
        <p className="font-sans text-sm">
          Brew date: <span className="kf-write-in inline-block">&nbsp;</span>
        </p>
      </header>

      <Section title="The numbers">
        <dl className="kf-keep grid grid-cols-3 gap-2 sm:grid-cols-6">
          {[
            ['OG', formatGravity(stats.og)],
            ['FG', formatGravity(stats.fg)],
            ['ABV', `${stats.abv.toFixed(1)}%`],
            ['IBU', stats.ibu.toFixed(0)],
            ['Colour', `${stats.srm.toFixed(1)} SRM`],
            ['Carbonation', doc.carbonation ? `${doc.carbonation.volumesCO2} vol` : '—'],
          ].map(([term, value]) => (
            <div key={term}>
              <dt className="text-xs font-semibold uppercase text-muted">{term}</dt>
              <dd className="kf-data text-base font-semibold">{value}</dd>
            </div>
          ))}
        </dl>
        <p className="mt-2 text-muted">
          Water: {volume(volumes.mashWaterL)} in the mash, {volume(volumes.spargeWaterL)} to sparge,{' '}
          {volume(volumes.preBoilVolumeL)} in the kettle before the boil.
        </p>
      </Section>

      <Section title="Fermentables">
        <table>
          <ColumnHeads names={['Weighed', 'Fermentable', 'Amount', 'Share']} />
          <tbody className="kf-data">
            {doc.fermentables.map((f, i) => (
              <tr key={i}>
                <td>
                  <Tick label={`Weighed ${f.name}`} />
                </td>
                <td>{f.name}</td>
                <td>{formatAmount(f.amountKg, 'mass', units)}</td>
                <td>{((f.amountKg / totalKg) * 100).toFixed(0)}%</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      {doc.water && (
        <Section title={`Water salts (for ${volume(doc.water.volumeL)} of water)`}>
          {doc.water.salts.length === 0 ? (
            <p>No salts.</p>
          ) : (
            <table>
              <ColumnHeads names={['Added', 'Salt', 'Amount']} />
              <tbody className="kf-data">
                {doc.water.salts.map((s, i) => (
                  <tr key={i}>
                    <td>
                      <Tick label={`Added ${SALT_LABEL[s.salt]}`} />
                    </td>
                    <td>{SALT_LABEL[s.salt]}</td>
                    <td>{s.grams} g</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </Section>
      )}

      <Section title="Mash">
        {doc.mash.steps.length === 0 ? (
          <p>No mash: an extract brew.</p>
        ) : (
          <table>
            <ColumnHeads names={['Done', 'Rest', 'Temperature', 'Time', 'Measured']} />
            <tbody className="kf-data">
              {doc.mash.steps.map((s, i) => (
                <tr key={i}>
                  <td>
                    <Tick label={`Finished ${s.name ?? `rest ${i + 1}`}`} />
                  </td>
                  <td>{s.name ?? `Rest ${i + 1}`}</td>
                  <td>{temp(s.tempC)}</td>
                  <td>{s.timeMin} min</td>
                  <td className="kf-write-in" />
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Section>

      <Section title="Hops, in the order they go in">
        {doc.hops.length === 0 ? (
          <p>No hops.</p>
        ) : (
          <ol className="space-y-1">
            {hopChecklist(doc.hops).map((h, i) => (
              <li key={i} className="flex items-start gap-2">
                <Tick label={`Added ${h.name}, ${HOP_USE_LABEL[h.use]}`} />
                <span>
                  <strong>{formatAmount(h.amountG, 'hopMass', units, units === 'us' ? 2 : 0)}</strong> {h.name} (
                  {h.alphaPct}% alpha, {h.form}) — {hopWhen(h, units)}
                </span>
              </li>
            ))}
          </ol>
        )}
      </Section>

      <Section title="Yeast and fermentation">
        <ul className="list-disc pl-5">
          {doc.yeasts.map((y, i) => (
            <li key={i}>
              {y.name} ({y.kind}, about {y.attenuationPct}% attenuation
              {y.tempMinC !== undefined && y.tempMaxC !== undefined && `, ${temp(y.tempMinC)}–${temp(y.tempMaxC)}`})
            </li>
          ))}
        </ul>
        {doc.fermentation.steps.length > 0 && (
          <table className="mt-2">
            <ColumnHeads names={['Done', 'Step', 'Temperature', 'Days', 'Started on']} />
            <tbody className="kf-data">
              {doc.fermentation.steps.map((s, i) => (
                <tr key={i}>
                  <td>
                    <Tick label={`Finished fermentation step ${i + 1}`} />
                  </td>
                  <td>Step {i + 1}</td>
                  <td>{temp(s.tempC)}</td>
                  <td>{s.days}</td>
                  <td className="kf-write-in" />
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {spunding && (
          <p className="mt-2">
            Spund: set the valve to <strong>{pressure(spunding.pressureKPa)}</strong> with the beer at{' '}
            {temp(spunding.tempC)} (about {spunding.volumesCO2.toFixed(2)} volumes CO₂). Seal only a pressure-rated
            vessel, keep its pressure-relief valve working and stay under the maker&apos;s rated pressure. Valve set to:{' '}
            <span className="kf-write-in inline-block min-w-[6rem]">&nbsp;</span>
          </p>
        )}
        {stats.carbonation && (
          <p className="mt-2">
            Carbonate to {stats.carbonation.volumesCO2} volumes: about{' '}
            {units === 'us'
              ? `${stats.carbonation.kegPressurePsi.toFixed(1)} psi`
              : `${stats.carbonation.kegPressureKPa.toFixed(0)} kPa`}{' '}
            on a keg at {temp(stats.carbonation.servingTempC)}. Stay within your keg&apos;s and regulator&apos;s rated
            pressure.
          </p>
        )}
      </Section>

      <Section title="Measured on the day">
        <table className="kf-keep">
          <ColumnHeads names={['Reading', 'Expected', 'Measured']} />
          <tbody className="kf-data">
            {measured.map(([reading, expected]) => (
              <tr key={reading}>
                <td>{reading}</td>
                <td>{expected}</td>
                <td className="kf-write-in">&nbsp;</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      {doc.notes.trim() && (
        <Section title="Notes">
          <Markdown source={doc.notes} />
        </Section>
      )}
    </article>
  );
}
