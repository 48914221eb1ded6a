'use client';

import { useId, useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { useBrewhouse } from '@/hooks/use-brewhouse';
import { ION_NAMES } from '@/lib/brewing/constants';
import { ACID_MEQ_PER_ML, acidForMashPh, predictedMashPh, type AcidKind } from '@/lib/brewing/mash-ph';
import type { Fermentable, IonName, SaltAddition, WaterProfile } from '@/lib/brewing/schema';
import { DISPLAY_UNITS, type UnitSystem } from '@/lib/brewing/units';
import {
  MASH_PH_TARGET,
  SULFATE_CHLORIDE_READING,
  ionOffTarget,
  planWaterSalts,
  residualAlkalinity,
  sulfateToChlorideRatio,
  waterAfterSalts,
  type SaltPlan,
} from '@/lib/brewing/water';
import { SOURCE_WATER_PRESETS, WATER_TARGET_PRESETS, matchingPreset } from '@/lib/brewing/water-targets';
import { ION_LABEL, SALT_LABEL } from '@/lib/format';
import { NumberField, SelectField } from './editor-fields';
import type { EditorValues } from './editor-form';
import { plainUnit } from './field-units';

const ACID_OPTIONS = [
  ['lactic_88', 'Lactic acid 88 %'],
  ['phosphoric_10', 'Phosphoric acid 10 %'],
] as const;

const MY_REPORT = 'my-report';
const OWN_NUMBERS = 'own';
const NO_TARGET = 'none';

/** A profile whose six ions are all numbers the schema accepts; null while one is empty or mistyped. */
function usableProfile(profile: Partial<Record<IonName, unknown>> | undefined): WaterProfile | null {
  if (!profile) return null;
  const result = {} as WaterProfile;
  for (const ion of ION_NAMES) {
    const value = profile[ion];
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) return null;
    result[ion] = value;
  }
  return result;
}

function usableVolume(volumeL: unknown): number | null {
  return typeof volumeL === 'number' && Number.isFinite(volumeL) && volumeL > 0 ? volumeL : null;
}

/** Salt rows with an amount typed in (the form holds an empty amount as null). */
function usableSalts(salts: readonly SaltAddition[] | undefined): SaltAddition[] {
  return (salts ?? []).filter(
    (s): s is SaltAddition => typeof s.grams === 'number' && Number.isFinite(s.grams) && s.grams >= 0,
  );
}

function fixed(value: number, decimals = 0): string {
  return value.toFixed(decimals);
}

/** Picks a named source water, the member's own report, or numbers typed in. */
export function SourceWaterPicker() {
  const { setValue } = useFormContext<EditorValues>();
  const source = useWatch<EditorValues, 'document.water.source'>({ name: 'document.water.source' });
  const { data: brewhouse } = useBrewhouse();
  const report = brewhouse?.waterReport ?? null;
  const profile = usableProfile(source);
  const preset = matchingPreset(SOURCE_WATER_PRESETS, profile ?? undefined);
  const isReport = report !== null && profile !== null && ION_NAMES.every((ion) => report[ion] === profile[ion]);
  const chosen = preset?.id ?? (isReport ? MY_REPORT : OWN_NUMBERS);
  const id = useId();
  const choose = (value: string) => {
    const next =
      value === MY_REPORT && report
        ? report
        : SOURCE_WATER_PRESETS.find((candidate) => candidate.id === value)?.profile;
    if (!next) return;
    for (const ion of ION_NAMES) setValue(`document.water.source.${ion}`, next[ion], { shouldDirty: true });
  };
  return (
    <div>
      <label htmlFor={id} className="kf-label">
        Water you start from
      </label>
      <select id={id} className="kf-input" value={chosen} onChange={(event) => choose(event.target.value)}>
        {SOURCE_WATER_PRESETS.map((candidate) => (
          <option key={candidate.id} value={candidate.id}>
            {candidate.name}
          </option>
        ))}
        {report && <option value={MY_REPORT}>My water report: {report.name}</option>}
        <option value={OWN_NUMBERS}>Numbers typed in below</option>
      </select>
      <p className="mt-1 font-sans text-xs text-muted">
        {preset?.note ??
          (isReport ? 'From the water report in your settings.' : 'Type the six ions from a water report below.')}{' '}
        {!report && (
          <>
            Save your own report in <a href="/settings">settings</a> to pick it here.
          </>
        )}
      </p>
    </div>
  );
}

/** Picks a named target profile, the brewer's own numbers, or none. */
export function TargetPicker({ units }: { units: UnitSystem }) {
  const { setValue } = useFormContext<EditorValues>();
  const target = useWatch<EditorValues, 'document.water.target'>({ name: 'document.water.target' });
  const [ownChosen, setOwnChosen] = useState(false);
  const preset = matchingPreset(WATER_TARGET_PRESETS, usableProfile(target) ?? undefined);
  const chosen = target === undefined ? NO_TARGET : preset && !ownChosen ? preset.id : OWN_NUMBERS;
  const id = useId();
  const concentration = plainUnit(DISPLAY_UNITS[units].concentration, 1);
  const choose = (value: string) => {
    setOwnChosen(value === OWN_NUMBERS);
    if (value === NO_TARGET) {
      setValue('document.water.target', undefined, { shouldDirty: true });
      return;
    }
    const next =
      WATER_TARGET_PRESETS.find((candidate) => candidate.id === value)?.profile ??
      usableProfile(target) ??
      WATER_TARGET_PRESETS[1].profile;
    setValue('document.water.target', { ...next }, { shouldDirty: true });
  };
  return (
    <div>
      <label htmlFor={id} className="kf-label">
        Water to aim for
      </label>
      <select id={id} className="kf-input" value={chosen} onChange={(event) => choose(event.target.value)}>
        <option value={NO_TARGET}>No target: I choose the salts myself</option>
        {WATER_TARGET_PRESETS.map((candidate) => (
          <option key={candidate.id} value={candidate.id}>
            {candidate.name}
          </option>
        ))}
        <option value={OWN_NUMBERS}>My own target</option>
      </select>
      {preset && chosen === preset.id && (
        <p className="mt-1 font-sans text-xs text-muted">
          {preset.reading} <span className="italic">Source: {preset.source}</span>
        </p>
      )}
      {chosen === OWN_NUMBERS && (
        <fieldset className="mt-3">
          <legend className="kf-label">My own target</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {ION_NAMES.map((ion) => (
              <NumberField
                key={ion}
                path={`document.water.target.${ion}`}
                label={`Target ${ION_LABEL[ion].toLowerCase()}`}
                unit={concentration}
              />
            ))}
          </div>
        </fieldset>
      )}
    </div>
  );
}

function IonBar({
  ion,
  now,
  proposed,
  target,
  unit,
}: {
  ion: IonName;
  now: number;
  proposed: number;
  target: number;
  unit: string;
}) {
  const top = Math.max(now, proposed, target, 1) * 1.15;
  const percent = (value: number) => `${(value / top) * 100}%`;
  const off = ionOffTarget(now, target);
  return (
    <li className="font-sans text-sm" data-ion={ion}>
      <div className="flex flex-wrap justify-between gap-x-2">
        <span className="font-semibold">{ION_LABEL[ion]}</span>
        <span className={`kf-data ${off ? 'text-caution' : 'text-bine'}`}>
          <span data-testid={`ion-now-${ion}`}>{fixed(now)}</span> of {fixed(target)} {unit}
          {off && <span className="sr-only"> (off target)</span>}
        </span>
      </div>
      <div className="relative mt-1 h-4" aria-hidden="true">
        <div className="absolute inset-x-0 top-1.5 h-1 rounded bg-line" />
        <div className="absolute top-0 h-1.5 rounded bg-copper/40" style={{ width: percent(proposed) }} />
        <div
          className={`absolute top-2 h-2 rounded ${off ? 'bg-caution' : 'bg-bine'}`}
          style={{ width: percent(now) }}
        />
        <div className="absolute -top-0.5 h-5 w-0.5 -translate-x-1/2 bg-ink" style={{ left: percent(target) }} />
      </div>
    </li>
  );
}

function ratioReading(ratio: number): string {
  if (ratio < SULFATE_CHLORIDE_READING.maltyBelow) return 'leans soft and malty';
  if (ratio > SULFATE_CHLORIDE_READING.bitterAbove) return 'leans dry and bitter';
  return 'balanced';
}

function missSentence(miss: SaltPlan['misses'][number], unit: string): string {
  const amount = `${fixed(Math.abs(miss.offMgPerL), 1)} ${unit}`;
  if (miss.fromSource) {
    return `${ION_LABEL[miss.ion]} stays ${amount} above target: your source water already has more than the target, and salts only add ions. Dilute with distilled water to bring it down.`;
  }
  return miss.offMgPerL > 0
    ? `${ION_LABEL[miss.ion]} ends ${amount} above target: the salts that bring the other ions up carry it along.`
    : `${ION_LABEL[miss.ion]} ends ${amount} below target: no mix of these salts reaches it without overshooting others.`;
}

/** Salts proposed for the target, the ions now and with them, and a button that writes them into the recipe. */
export function SaltPlanPanel({ units }: { units: UnitSystem }) {
  const { setValue } = useFormContext<EditorValues>();
  const water = useWatch<EditorValues, 'document.water'>({ name: 'document.water' });
  const unit = DISPLAY_UNITS[units].concentration;
  const source = usableProfile(water?.source);
  const target = usableProfile(water?.target);
  const volumeL = usableVolume(water?.volumeL);
  if (!water?.target) return null;
  if (!source || !target || !volumeL) {
    return (
      <p role="status" className="font-sans text-sm text-muted">
        The salt plan appears once the water treated, the source water and the target all have numbers.
      </p>
    );
  }
  const plan = planWaterSalts(source, target, volumeL);
  const now = waterAfterSalts(source, usableSalts(water.salts), volumeL);
  const ratio = sulfateToChlorideRatio(now);
  const ra = residualAlkalinity(now);
  const planRatio = sulfateToChlorideRatio(plan.water);
  return (
    <section aria-labelledby="salt-plan-title" className="rounded-md border border-line p-3">
      <h3 id="salt-plan-title" className="text-base font-semibold">
        Salts for this target
      </h3>
      {plan.salts.length === 0 ? (
        <p className="mt-1 font-sans text-sm">No salt moves this water closer to the target.</p>
      ) : (
        <ul className="kf-data mt-1 font-sans text-sm" aria-label="Proposed salts">
          {plan.salts.map((salt) => (
            <li key={salt.salt}>
              {SALT_LABEL[salt.salt]}: <strong className="font-semibold">{fixed(salt.grams, 1)} g</strong>
            </li>
          ))}
        </ul>
      )}
      {plan.misses.length === 0 ? (
        <p className="mt-2 font-sans text-sm text-bine">These salts reach every ion of the target.</p>
      ) : (
        <div role="status" className="mt-2 rounded-md border border-caution p-2 font-sans text-sm">
          <p className="font-semibold text-caution">This target cannot be reached exactly.</p>
          <ul className="mt-1 list-disc pl-5">
            {plan.misses.map((miss) => (
              <li key={miss.ion}>{missSentence(miss, unit)}</li>
            ))}
          </ul>
        </div>
      )}
      <p className="mt-2 font-sans text-xs text-muted">
        With these salts: sulfate to chloride {fixed(planRatio, 2)} ({ratioReading(planRatio)}), residual alkalinity{' '}
        {fixed(residualAlkalinity(plan.water))} mg/L as CaCO₃.
      </p>
      {plan.salts.length > 0 && (
        <button
          type="button"
          className="kf-btn mt-3"
          onClick={() =>
            setValue(
              'document.water.salts',
              plan.salts.map((salt) => ({ ...salt, grams: Math.round(salt.grams * 10) / 10 })),
              { shouldDirty: true },
            )
          }
        >
          Use these salts
        </button>
      )}
      <h4 className="mt-4 text-sm font-semibold">Your water now, against the target</h4>
      <p className="font-sans text-xs text-muted">
        Lower bar: after the salts in this recipe. Upper, lighter bar: with the salts above. Tick: the target.
      </p>
      <ul className="mt-2 space-y-2" aria-label="Ions after your salts">
        {ION_NAMES.map((ion) => (
          <IonBar key={ion} ion={ion} now={now[ion]} proposed={plan.water[ion]} target={target[ion]} unit={unit} />
        ))}
      </ul>
      <dl className="kf-data mt-3 space-y-1 font-sans text-sm">
        <div className="flex flex-wrap justify-between gap-2">
          <dt>Sulfate to chloride, now</dt>
          <dd className="font-semibold" data-testid="water-ratio-now">
            {fixed(ratio, 2)} ({ratioReading(ratio)})
          </dd>
        </div>
        <div className="flex flex-wrap justify-between gap-2">
          <dt>Residual alkalinity, now</dt>
          <dd className="font-semibold">{fixed(ra)} mg/L as CaCO₃</dd>
        </div>
      </dl>
    </section>
  );
}

function usableFermentables(rows: EditorValues['document']['fermentables'] | undefined): Fermentable[] {
  return (rows ?? []).filter(
    (f): f is Fermentable =>
      typeof f.amountKg === 'number' &&
      f.amountKg > 0 &&
      typeof f.colorLovibond === 'number' &&
      Number.isFinite(f.colorLovibond) &&
      typeof f.name === 'string',
  );
}

/** Acid for a chosen mash pH: lactic or phosphoric, worked out from the predicted pH without acid. */
export function AcidPanel() {
  const { setValue } = useFormContext<EditorValues>();
  const water = useWatch<EditorValues, 'document.water'>({ name: 'document.water' });
  const fermentables = useWatch<EditorValues, 'document.fermentables'>({ name: 'document.fermentables' });
  const thickness = useWatch<EditorValues, 'document.batch.mashWaterLPerKg'>({
    name: 'document.batch.mashWaterLPerKg',
  });
  const [kind, setKind] = useState<AcidKind>('lactic_88');
  const [wantedText, setWantedText] = useState('5.4');
  const ids = useId();
  const source = usableProfile(water?.source);
  const volumeL = usableVolume(water?.volumeL);
  const grist = usableFermentables(fermentables);
  const mashLPerKg = typeof thickness === 'number' && thickness > 0 ? thickness : null;
  const withoutAcid =
    source && volumeL && mashLPerKg
      ? predictedMashPh({
          fermentables: grist,
          water: waterAfterSalts(source, usableSalts(water?.salts), volumeL),
          mashWaterLPerKg: mashLPerKg,
        })
      : null;
  const wanted = Number(wantedText.replace(',', '.'));
  const wantedOk = Number.isFinite(wanted) && wanted >= 4.8 && wanted <= 6;
  const mL = withoutAcid !== null && wantedOk ? acidForMashPh(grist, withoutAcid, wanted, kind) : null;
  const acid = water?.acid;
  return (
    <section aria-labelledby={`${ids}-title`} className="rounded-md border border-line p-3">
      <h3 id={`${ids}-title`} className="text-base font-semibold">
        Acid for a mash pH (optional)
      </h3>
      {withoutAcid === null ? (
        <p className="mt-1 font-sans text-sm text-muted">
          Needs a mashed grain, the water treated, the source water and the mash thickness.
        </p>
      ) : (
        <>
          <p className="mt-1 font-sans text-sm">
            Predicted mash pH without acid: <strong className="kf-data">{fixed(withoutAcid, 2)}</strong> (pale beers
            usually aim for {MASH_PH_TARGET.min}–{MASH_PH_TARGET.max} at room temperature).
          </p>
          <div className="mt-2 grid grid-cols-2 gap-3">
            <div>
              <label htmlFor={`${ids}-kind`} className="kf-label">
                Acid
              </label>
              <select
                id={`${ids}-kind`}
                className="kf-input"
                value={kind}
                onChange={(event) => setKind(event.target.value as AcidKind)}
              >
                {ACID_OPTIONS.map(([value, words]) => (
                  <option key={value} value={value}>
                    {words}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor={`${ids}-ph`} className="kf-label">
                Mash pH wanted
              </label>
              <input
                id={`${ids}-ph`}
                className="kf-input kf-data"
                inputMode="decimal"
                value={wantedText}
                aria-invalid={!wantedOk || undefined}
                aria-describedby={wantedOk ? undefined : `${ids}-ph-error`}
                onChange={(event) => setWantedText(event.target.value)}
              />
              {!wantedOk && (
                <p id={`${ids}-ph-error`} className="kf-field-error">
                  Give a mash pH between 4.8 and 6.
                </p>
              )}
            </div>
          </div>
          {mL !== null && (
            <p className="mt-2 font-sans text-sm" role="status">
              {mL === 0
                ? 'The mash is already at or below that pH: no acid needed (acid only lowers pH).'
                : `About ${fixed(mL, 1)} mL of ${ACID_OPTIONS.find(([value]) => value === kind)![1].toLowerCase()} in the mash water (${fixed(mL * ACID_MEQ_PER_ML[kind], 0)} mEq).`}
            </p>
          )}
          {mL !== null && mL > 0 && (
            <button
              type="button"
              className="kf-btn-quiet mt-2"
              onClick={() =>
                setValue('document.water.acid', { kind, mL: Math.round(mL * 10) / 10 }, { shouldDirty: true })
              }
            >
              Use this acid
            </button>
          )}
        </>
      )}
      {acid && (
        <div className="mt-3 grid grid-cols-[1fr_1fr_auto] items-end gap-3">
          <SelectField path="document.water.acid.kind" label="Acid in this recipe" options={ACID_OPTIONS} />
          <NumberField path="document.water.acid.mL" label="Amount" unit={plainUnit('mL', 1)} />
          <button
            type="button"
            className="kf-btn-quiet"
            onClick={() => setValue('document.water.acid', undefined, { shouldDirty: true })}
          >
            Remove acid
          </button>
        </div>
      )}
      <p className="mt-2 font-sans text-xs text-caution">
        Caution: concentrated acids burn skin and eyes. Wear gloves and eye protection, measure with a syringe, and add
        acid to water, never water to acid (common practice; follow the maker’s safety sheet).
      </p>
    </section>
  );
}
