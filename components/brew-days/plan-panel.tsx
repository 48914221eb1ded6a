'use client';

import { differenceInCalendarDays, format, parseISO } from 'date-fns';
import { useMemo, useState } from 'react';
import type { RecipeDocument } from '@/lib/brewing/schema';
import { sendJson } from '@/lib/http/client';
import {
  PlanDateError,
  planBrew,
  planOptionsSchema,
  type BrewPlan,
  type CarbonationMethod,
  type DryHopPlace,
  type PlanEventKind,
} from '@/lib/brew-days/schedule';

const CARBONATION_LABELS: Record<CarbonationMethod, string> = {
  set_and_forget: 'Keg at serving pressure (slow, gentle)',
  burst: 'Keg, fast burst at high pressure',
  spunding: 'Spund at the end of fermentation',
  bottle: 'Bottles with priming sugar',
};

const BAR_COLOURS: Record<PlanEventKind, string> = {
  brew: '#b45f2a',
  ferment: '#c9962e',
  dry_hop: '#5b8a3c',
  spunding: '#8a5bb4',
  crash: '#3c74a8',
  package: '#6b6b6b',
  carbonate: '#2e8f8a',
  pour: '#b42a4a',
};

/** "When must it pour?": the calendar back from a date, computed live and kept with the brew day. */
export function PlanPanel({
  brewDayId,
  brewedOn,
  document,
  saved,
}: {
  brewDayId: string;
  brewedOn: string;
  document: RecipeDocument;
  saved: BrewPlan | null;
}) {
  const today = format(new Date(), 'yyyy-MM-dd');
  const [pourOn, setPourOn] = useState(saved?.pourOn ?? '');
  const [fermentTemp, setFermentTemp] = useState(
    saved?.options.fermentTempC != null ? String(saved.options.fermentTempC) : '',
  );
  const [carbonation, setCarbonation] = useState<CarbonationMethod>(saved?.options.carbonation ?? 'set_and_forget');
  const [dryHopIn, setDryHopIn] = useState<DryHopPlace>(saved?.options.dryHopIn ?? 'fermenter');
  const [crash, setCrash] = useState(saved?.options.crash ?? true);
  const [status, setStatus] = useState<string | null>(saved ? 'Plan saved with this brew day.' : null);
  const [busy, setBusy] = useState(false);

  const options = {
    pourOn,
    brewOn: brewedOn,
    fermentTempC: fermentTemp === '' ? null : Number(fermentTemp),
    carbonation,
    dryHopIn,
    crash,
  };
  const result = useMemo((): { plan: BrewPlan } | { error: string } | null => {
    if (!pourOn) return null;
    const parsed = planOptionsSchema.safeParse(options);
    if (!parsed.success) return { error: parsed.error.issues[0].message };
    try {
      return { plan: planBrew(document, parsed.data, today) };
    } catch (e) {
      if (e instanceof PlanDateError) return { error: e.message };
      throw e;
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [pourOn, fermentTemp, carbonation, dryHopIn, crash, document, today, brewedOn]);

  async function save() {
    setBusy(true);
    try {
      await sendJson(`/api/brew-days/${brewDayId}/plan`, 'PUT', options);
      setStatus('Plan saved with this brew day.');
    } catch (e) {
      setStatus((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="plan-title" className="rounded-md border border-line p-4">
      <h2 id="plan-title" className="text-xl font-semibold">
        When must it pour?
      </h2>
      <div className="mt-3 grid gap-3 font-sans text-sm sm:grid-cols-2">
        <label className="flex flex-col gap-1">
          Pour date
          <input type="date" min={today} value={pourOn} onChange={(e) => setPourOn(e.target.value)} />
        </label>
        <label className="flex flex-col gap-1">
          Fermentation temperature, °C (blank: the recipe&apos;s)
          <input
            type="number"
            inputMode="decimal"
            step="0.5"
            value={fermentTemp}
            onChange={(e) => setFermentTemp(e.target.value)}
          />
        </label>
        <label className="flex flex-col gap-1">
          Carbonation
          <select value={carbonation} onChange={(e) => setCarbonation(e.target.value as CarbonationMethod)}>
            {Object.entries(CARBONATION_LABELS).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          Dry hop
          <select value={dryHopIn} onChange={(e) => setDryHopIn(e.target.value as DryHopPlace)}>
            <option value="fermenter">In the fermenter</option>
            <option value="keg">In the keg</option>
          </select>
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={crash} onChange={(e) => setCrash(e.target.checked)} /> Cold crash before
          packaging
        </label>
      </div>

      {result && 'error' in result && (
        <p role="alert" className="mt-3 font-sans text-sm text-danger">
          {result.error}
        </p>
      )}
      {result && 'plan' in result && <PlanView plan={result.plan} />}

      {result && 'plan' in result && (
        <div className="mt-3 flex flex-wrap items-center gap-3 font-sans text-sm">
          <button type="button" className="kf-btn" onClick={save} disabled={busy}>
            Save plan
          </button>
          {saved && (
            <a className="kf-btn-quiet" href={`/api/brew-days/${brewDayId}/calendar`} download>
              Add to my calendar (.ics)
            </a>
          )}
          {status && <span role="status">{status}</span>}
        </div>
      )}
    </section>
  );
}

function PlanView({ plan }: { plan: BrewPlan }) {
  const span = Math.max(1, differenceInCalendarDays(parseISO(plan.readyOn), parseISO(plan.brewOn)) + 1);
  const pourOffset = differenceInCalendarDays(parseISO(plan.pourOn), parseISO(plan.brewOn));
  const width = 600;
  const row = 26;
  const left = 0;
  const dayW = width / Math.max(span, pourOffset + 1);
  const height = plan.events.length * row + 20;
  return (
    <div className="mt-4">
      <p className={`font-sans text-sm ${plan.shortfallDays > 0 ? 'text-danger' : ''}`} data-testid="plan-summary">
        {plan.summary}
      </p>
      {plan.suggestions.length > 0 && (
        <ul className="mt-2 list-disc pl-5 font-sans text-sm">
          {plan.suggestions.map((s) => (
            <li key={s.change}>
              {s.change} Saves about {s.savesDays} day{s.savesDays === 1 ? '' : 's'}.
            </li>
          ))}
        </ul>
      )}
      <svg
        role="img"
        aria-label={`Timeline from ${plan.brewOn} to ${plan.readyOn}`}
        viewBox={`0 0 ${width} ${height}`}
        className="mt-3 w-full"
      >
        {plan.events.map((e, i) => {
          const x = left + differenceInCalendarDays(parseISO(e.startOn), parseISO(plan.brewOn)) * dayW;
          const w = Math.max(dayW * (differenceInCalendarDays(parseISO(e.endOn), parseISO(e.startOn)) + 1), 4);
          return (
            <g key={`${e.kind}-${i}`}>
              <rect x={x} y={i * row + 4} width={w} height={row - 8} rx={3} fill={BAR_COLOURS[e.kind]} />
              <text
                x={Math.min(x + w + 4, width - 4)}
                y={i * row + row / 2 + 4}
                fontSize="12"
                textAnchor={x + w + 4 > width - 150 ? 'end' : 'start'}
              >
                {e.title}
              </text>
            </g>
          );
        })}
        <line
          x1={pourOffset * dayW + dayW / 2}
          x2={pourOffset * dayW + dayW / 2}
          y1={0}
          y2={height}
          stroke="#b42a4a"
          strokeDasharray="4 3"
        />
      </svg>
      <ol className="mt-3 space-y-2 font-sans text-sm">
        {plan.events.map((e, i) => (
          <li key={`${e.kind}-${i}`}>
            <strong>
              {format(parseISO(e.startOn), 'EEE d MMM')}
              {e.endOn !== e.startOn && <> – {format(parseISO(e.endOn), 'EEE d MMM')}</>}
            </strong>{' '}
            {e.title}. {e.detail}
            {e.source && <span className="text-muted"> ({e.source})</span>}
            {e.caution && <span className="block text-caution">{e.caution}</span>}
          </li>
        ))}
      </ol>
    </div>
  );
}
