import type { ReactNode } from 'react';
import type { RecipeDocument } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import { HOP_USE_LABEL, SALT_LABEL, formatAmount } from '@/lib/format';
import { SrmSwatch } from './srm-swatch';
import { lovibondToSrm } from '@/lib/brewing/colour';
import { yeastTemperatureFlags } from '@/lib/brewing/yeast-temperature';

function Table({ caption, head, children }: { caption: string; head: string[]; children: ReactNode }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse font-sans text-sm">
        <caption className="mb-2 text-left font-serif text-lg font-semibold text-ink">{caption}</caption>
        <thead>
          <tr className="border-b border-line text-left text-muted">
            {head.map((h) => (
              <th key={h} scope="col" className="py-1.5 pr-3 font-semibold">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="kf-data">{children}</tbody>
      </table>
    </div>
  );
}

const cell = 'py-1.5 pr-3 align-top';

/**
 * The ingredients and schedules of one recipe version, read-only, in the reader's units. The notes
 * come rendered from the caller (members' Markdown), so this view stays light in the browser.
 */
export function RecipeDocumentView({
  doc,
  units,
  notes,
}: {
  doc: RecipeDocument;
  units: UnitSystem;
  notes: ReactNode;
}) {
  const totalKg = doc.fermentables.reduce((n, f) => n + f.amountKg, 0);
  const flags = yeastTemperatureFlags(doc);
  const temp = (c: number) => formatAmount(c, 'temperature', units);
  return (
    <div className="space-y-8">
      <p className="font-sans text-sm text-muted">
        {formatAmount(doc.batch.volumeL, 'volume', units, 1)} into the fermenter · {doc.batch.boilTimeMin} min boil ·{' '}
        {doc.batch.efficiencyPct}% brewhouse efficiency
      </p>
      <Table caption="Fermentables" head={['Name', 'Amount', 'Share', 'Colour', 'Kind']}>
        {doc.fermentables.map((f, i) => (
          <tr key={i} className="border-b border-line/50">
            <td className={cell}>{f.name}</td>
            <td className={cell}>{formatAmount(f.amountKg, 'mass', units)}</td>
            <td className={cell}>{((f.amountKg / totalKg) * 100).toFixed(0)}%</td>
            <td className={cell}>
              <span className="inline-flex items-center gap-1.5">
                <SrmSwatch srm={lovibondToSrm(f.colorLovibond)} size="sm" /> {f.colorLovibond} °L
              </span>
            </td>
            <td className={cell}>{f.kind}</td>
          </tr>
        ))}
      </Table>
      {doc.hops.length > 0 && (
        <Table caption="Hops" head={['Name', 'Amount', 'Alpha', 'Use', 'Time', 'Form']}>
          {doc.hops.map((h, i) => (
            <tr key={i} className="border-b border-line/50">
              <td className={cell}>{h.name}</td>
              <td className={cell}>{formatAmount(h.amountG, 'hopMass', units, units === 'us' ? 2 : 0)}</td>
              <td className={cell}>{h.alphaPct}%</td>
              <td className={cell}>
                {HOP_USE_LABEL[h.use]}
                {h.use === 'whirlpool' && h.tempC !== undefined && ` at ${formatAmount(h.tempC, 'temperature', units)}`}
              </td>
              <td className={cell}>
                {h.use === 'dry_hop' ? `${+(h.timeMin / 1440).toFixed(1)} days` : `${h.timeMin} min`}
              </td>
              <td className={cell}>{h.form}</td>
            </tr>
          ))}
        </Table>
      )}
      <Table caption="Yeast" head={['Name', 'Kind', 'Attenuation', 'Temperature']}>
        {doc.yeasts.map((y, i) => (
          <tr key={i} className="border-b border-line/50">
            <td className={cell}>{y.name}</td>
            <td className={cell}>{y.kind}</td>
            <td className={cell}>{y.attenuationPct}%</td>
            <td className={cell}>
              {y.tempMinC !== undefined && y.tempMaxC !== undefined
                ? `${formatAmount(y.tempMinC, 'temperature', units)} – ${formatAmount(y.tempMaxC, 'temperature', units)}`
                : '—'}
            </td>
          </tr>
        ))}
      </Table>
      <div className="grid gap-8 md:grid-cols-2">
        <Table caption="Mash" head={['Step', 'Temperature', 'Time']}>
          {doc.mash.steps.map((s, i) => (
            <tr key={i} className="border-b border-line/50">
              <td className={cell}>{s.name ?? `Step ${i + 1}`}</td>
              <td className={cell}>{formatAmount(s.tempC, 'temperature', units)}</td>
              <td className={cell}>{s.timeMin} min</td>
            </tr>
          ))}
        </Table>
        <div>
          <Table caption="Fermentation" head={['Step', 'Temperature', 'Days']}>
            {doc.fermentation.steps.map((s, i) => {
              const stepFlags = flags.filter((flag) => flag.stepIndex === i);
              return (
                <tr key={i} className="border-b border-line/50">
                  <td className={cell}>Step {i + 1}</td>
                  <td className={cell}>
                    {temp(s.tempC)}
                    {stepFlags.map((flag) => (
                      <span key={flag.yeastName} className="block font-sans text-xs font-semibold text-caution">
                        <span aria-hidden="true">⚠ </span>
                        {flag.side} {flag.yeastName}’s {flag.side === 'below' ? 'lowest' : 'highest'}{' '}
                        {temp(flag.limitC)}
                      </span>
                    ))}
                  </td>
                  <td className={cell}>{s.days}</td>
                </tr>
              );
            })}
          </Table>
          {doc.fermentation.spunding && (
            <p className="mt-2 font-sans text-sm">
              Spunded: valve at{' '}
              {formatAmount(doc.fermentation.spunding.pressureKPa, 'pressure', units, units === 'us' ? 1 : 0)} with the
              beer at {temp(doc.fermentation.spunding.tempC)}. Use a pressure-rated vessel with a working relief valve.
            </p>
          )}
        </div>
      </div>
      {doc.water && (
        <Table caption={`Water (${formatAmount(doc.water.volumeL, 'volume', units, 1)})`} head={['Addition', 'Amount']}>
          {doc.water.salts.length === 0 && (
            <tr>
              <td className={cell} colSpan={2}>
                No salts added
              </td>
            </tr>
          )}
          {doc.water.salts.map((s, i) => (
            <tr key={i} className="border-b border-line/50">
              <td className={cell}>{SALT_LABEL[s.salt]}</td>
              <td className={cell}>{s.grams} g</td>
            </tr>
          ))}
          {doc.water.acid && (
            <tr className="border-b border-line/50">
              <td className={cell}>
                {doc.water.acid.kind === 'lactic_88' ? 'Lactic acid 88 %' : 'Phosphoric acid 10 %'}
              </td>
              <td className={cell}>{doc.water.acid.mL} mL</td>
            </tr>
          )}
        </Table>
      )}
      {doc.notes.trim() && (
        <section aria-labelledby="notes-heading">
          <h2 id="notes-heading" className="text-lg font-semibold">
            Notes
          </h2>
          {notes}
        </section>
      )}
    </div>
  );
}
