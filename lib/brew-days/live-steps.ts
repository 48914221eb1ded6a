import { mashAndSpargeVolumes, preBoilGravity, strikeWaterTempC, type RecipeDocument } from '@/lib/brewing';
import type { Hop } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import { formatAmount, formatGravity } from '@/lib/format';
import type { LiveField } from './schemas';

// Pure: the checklist brew-day mode walks through, built from the exact version's document.

/** Grain temperature the strike water is worked out for (the printed brew sheet assumes the same). */
const GRAIN_TEMP_C = 20;
/** A mash-out rest: 75–78 °C for about 10 minutes stops the enzymes and thins the wort (common practice). */
const MASH_OUT_MIN_C = 75;
const MASH_OUT_TEMP_C = 76;
const MASH_OUT_MIN = 10;

export type LiveCaution = 'hotLiquor' | 'boil' | 'chilling' | 'lifting' | 'pressure';

interface LiveAnnouncement {
  id: string;
  /** Minutes after the step's timer starts. */
  atMin: number;
  text: string;
}

export interface LiveStep {
  id: string;
  title: string;
  detail: string;
  /** The step's timer in minutes, or null for a step without one. */
  timerMin: number | null;
  announcements: LiveAnnouncement[];
  /** Brew-day fields measured at this step. */
  fields: LiveField[];
  caution: LiveCaution | null;
  /** Steps done on a later day (spunding, packaging). */
  later: boolean;
}

function step(s: Partial<LiveStep> & Pick<LiveStep, 'id' | 'title' | 'detail'>): LiveStep {
  return { timerMin: null, announcements: [], fields: [], caution: null, later: false, ...s };
}

function hopList(hops: readonly Hop[], units: UnitSystem): string {
  return hops.map((h) => `${formatAmount(h.amountG, 'hopMass', units, 0)} ${h.name}`).join(', ');
}

/**
 * Boil additions grouped by minute: each is announced when that many minutes of the boil are left
 * (an addition as long as the boil, or longer, goes in at the start).
 */
function boilAnnouncements(doc: RecipeDocument, units: UnitSystem): LiveAnnouncement[] {
  const boilMin = doc.batch.boilTimeMin;
  const byLeft = new Map<number, Hop[]>();
  for (const hop of doc.hops) {
    if (hop.use !== 'boil') continue;
    const left = Math.min(hop.timeMin, boilMin);
    byLeft.set(left, [...(byLeft.get(left) ?? []), hop]);
  }
  return [...byLeft]
    .sort(([a], [b]) => b - a)
    .map(([left, hops]) => ({
      id: `boil-${left}`,
      atMin: boilMin - left,
      text:
        left === 0
          ? `Flame-out: add ${hopList(hops, units)}`
          : left === boilMin
            ? `Start of the boil: add ${hopList(hops, units)}`
            : `${left} minutes left: add ${hopList(hops, units)}`,
    }));
}

/** The brew day in order, from strike water to pitching, then the later pressure steps. */
export function liveSteps(doc: RecipeDocument, stats: { og: number }, units: UnitSystem): LiveStep[] {
  const temp = (c: number) => formatAmount(c, 'temperature', units);
  const volume = (l: number) => formatAmount(l, 'volume', units, 1);
  const steps: LiveStep[] = [];
  const water = mashAndSpargeVolumes(doc);
  const rests = doc.mash.steps;
  const firstRest = rests[0];
  const mashHops = doc.hops.filter((h) => h.use === 'mash');
  if (firstRest) {
    const strikeC = strikeWaterTempC(firstRest.tempC, GRAIN_TEMP_C, doc.batch.mashWaterLPerKg);
    steps.push(
      step({
        id: 'strike',
        title: `Heat the strike water to ${temp(strikeC)}`,
        detail: `${volume(water.mashWaterL)} of water, for grain at ${temp(GRAIN_TEMP_C)} to settle at ${temp(firstRest.tempC)}.`,
        fields: ['strikeTempC'],
        caution: 'hotLiquor',
      }),
    );
    const last = rests.length - 1;
    rests.forEach((rest, i) => {
      const isMashOut = i === last && i > 0 && rest.tempC >= MASH_OUT_MIN_C;
      steps.push(
        step({
          id: isMashOut ? 'mash-out' : `mash-${i + 1}`,
          title: isMashOut
            ? `Mash-out at ${temp(rest.tempC)} for ${rest.timeMin} min`
            : `${rest.name ?? (i === 0 ? 'Mash in' : `Rest ${i + 1}`)}: ${temp(rest.tempC)} for ${rest.timeMin} min`,
          detail:
            i === 0
              ? `Stir the grain into the strike water and check the temperature.${mashHops.length ? ` Mash hops: ${hopList(mashHops, units)}.` : ''} Take the pH about 15 minutes in.`
              : `Raise the mash to ${temp(rest.tempC)} and hold it.`,
          timerMin: rest.timeMin,
          fields: i === 0 ? ['mashTempC', 'mashPh'] : [],
          caution: i === 0 ? 'hotLiquor' : null,
        }),
      );
    });
    if (!(rests.length > 1 && rests[last].tempC >= MASH_OUT_MIN_C)) {
      steps.push(
        step({
          id: 'mash-out',
          title: `Mash-out at ${temp(MASH_OUT_TEMP_C)} for ${MASH_OUT_MIN} min (optional)`,
          detail: 'Raising the mash stops the enzymes and lets the wort run freely.',
          timerMin: MASH_OUT_MIN,
          caution: 'hotLiquor',
        }),
      );
    }
  }
  const firstWort = doc.hops.filter((h) => h.use === 'first_wort');
  steps.push(
    step({
      id: 'sparge',
      title: `Collect ${volume(water.preBoilVolumeL)} of wort`,
      detail: `Run off and sparge with ${volume(water.spargeWaterL)} of water; the recipe expects a pre-boil gravity of ${formatGravity(preBoilGravity(stats.og, doc.batch))}.${firstWort.length ? ` First-wort hops into the kettle: ${hopList(firstWort, units)}.` : ''}`,
      fields: ['preBoilVolumeL', 'preBoilGravity'],
      caution: 'hotLiquor',
    }),
  );
  steps.push(
    step({
      id: 'boil',
      title: `Boil for ${doc.batch.boilTimeMin} min`,
      detail: 'Start the timer when the wort reaches a rolling boil; each addition is called at its minute.',
      timerMin: doc.batch.boilTimeMin,
      announcements: boilAnnouncements(doc, units),
      fields: ['postBoilVolumeL'],
      caution: 'boil',
    }),
  );
  const stand = doc.hops.filter((h) => h.use === 'whirlpool');
  if (stand.length) {
    const standMin = Math.max(...stand.map((h) => h.timeMin));
    const standTemps = [...new Set(stand.flatMap((h) => (h.tempC === undefined ? [] : [h.tempC])))];
    steps.push(
      step({
        id: 'hop-stand',
        title: `Hop stand for ${standMin} min`,
        detail: `${standTemps.length ? `Cool to ${standTemps.map(temp).join(' / ')}, then add` : 'Add'} ${hopList(stand, units)} and let them steep, stirring now and then.`,
        timerMin: standMin,
        caution: 'hotLiquor',
      }),
    );
  }
  const pitchC = doc.fermentation.steps[0]?.tempC ?? null;
  steps.push(
    step({
      id: 'chill',
      title: pitchC === null ? 'Chill to pitching temperature' : `Chill to ${temp(pitchC)}`,
      detail: 'Chill quickly with the lid on, then let the trub settle before transferring.',
      caution: 'chilling',
    }),
  );
  steps.push(
    step({
      id: 'transfer',
      title: 'Transfer to the fermenter',
      detail: `The recipe expects ${volume(doc.batch.volumeL)} at ${formatGravity(stats.og)}. Take the OG from the fermenter once it is mixed.`,
      fields: ['og', 'fermenterVolumeL'],
      caution: 'lifting',
    }),
  );
  steps.push(
    step({
      id: 'pitch',
      title: 'Pitch the yeast',
      detail: `${doc.yeasts.map((y) => y.name).join(' and ')}${pitchC === null ? '' : `, with the wort at ${temp(pitchC)}`}.`,
      fields: ['pitchTempC'],
    }),
  );
  const spunding = doc.fermentation.spunding;
  if (spunding) {
    steps.push(
      step({
        id: 'spund',
        title: `Later: spund at ${formatAmount(spunding.pressureKPa, 'pressure', units, 0)}`,
        detail: 'Close the fermenter with the spunding valve when a few gravity points remain.',
        caution: 'pressure',
        later: true,
      }),
    );
  }
  steps.push(
    step({
      id: 'package',
      title: 'Later: keg or bottle',
      detail: 'Package once the gravity has held steady for two days.',
      caution: 'pressure',
      later: true,
    }),
  );
  return steps;
}

export const LIVE_FIELD_LABELS: Record<LiveField, string> = {
  strikeTempC: 'Strike water temperature',
  mashTempC: 'Mash temperature',
  mashPh: 'Mash pH',
  preBoilVolumeL: 'Pre-boil volume',
  preBoilGravity: 'Pre-boil gravity',
  postBoilVolumeL: 'Post-boil volume',
  og: 'OG',
  fermenterVolumeL: 'Volume into the fermenter',
  pitchTempC: 'Pitching temperature',
};

/** A field's value as brew-day mode sends and compares it: a number, a typed gravity, or nothing. */
export type LiveValue =
  number | { method: 'hydrometer' | 'refractometer'; value: number; sampleTempC?: number | null } | null;

/** Two values the same to six significant figures (stored reals come back rounded). */
export function sameLiveValue(a: LiveValue | undefined, b: LiveValue | undefined): boolean {
  return liveValueKey(a) === liveValueKey(b);
}

/** A value as a string that two equal values share (to six significant figures). */
export function liveValueKey(v: LiveValue | undefined): string {
  if (v === undefined) return 'unknown';
  if (v === null) return 'null';
  const n = (x: number | null | undefined) => (x === null || x === undefined ? null : Number(x.toPrecision(6)));
  return typeof v === 'number' ? JSON.stringify(n(v)) : JSON.stringify([v.method, n(v.value), n(v.sampleTempC)]);
}

export interface LiveFieldState {
  value: LiveValue;
  /** When brew-day mode last saved it (null when it came from the form, or is empty). */
  savedAt: string | null;
  /** Who saved it there (null as for savedAt). */
  savedBy: string | null;
}

interface LiveConflictSides<T> {
  /** The conflict entry's id, which a choice names. */
  id: string;
  /** The value that arrived second, kept aside, with who entered it, when, and its idempotency key. */
  entered: T;
  enteredBy: string | null;
  enteredAt: string;
  enteredKey: string;
  /** What the server holds now, with who saved it there and when (null: the form, or never). */
  saved: T;
  savedBy: string | null;
  savedAt: string | null;
  /** Names the saved side as shown; a choice sent with a token that no longer matches is refused. */
  savedToken: string;
}

/** Two values for one field or step, open until the brewer chooses; every device is shown it. */
export type LiveConflict =
  | ({ kind: 'field'; field: LiveField } & LiveConflictSides<LiveValue>)
  | ({ kind: 'step'; stepId: string } & LiveConflictSides<boolean>);

/** What the server holds of a brew day in brew-day mode: each field, the steps ticked off, and open conflicts. */
export interface LiveState {
  brewDayId: string;
  fields: Record<LiveField, LiveFieldState>;
  checkedSteps: Record<string, string>;
  /** Each step's last saved write (its idempotency key), which the device's next tick names as `basedOn`. */
  stepRevisions: Record<string, string>;
  conflicts: LiveConflict[];
}
