import { describe, expect, it } from 'vitest';
import { recipeDocumentSchema, YEAST_KINDS, type RecipeDocument } from '@/lib/brewing/schema';
import { minimalInput } from '@/lib/brewing/test-fixtures';
import { planToIcs } from './plan-ics';
import { PlanDateError, carbonationDays, fermentationDays, planBrew, planOptionsSchema } from './schedule';

function doc(kind: 'kveik' | 'ale' | 'lager', tempC: number, extra: Partial<RecipeDocument> = {}): RecipeDocument {
  const input = minimalInput();
  return recipeDocumentSchema.parse({
    ...input,
    yeasts: [{ name: `${kind} yeast`, kind, attenuationPct: 78 }],
    fermentation: { steps: [{ tempC, days: 4 }] },
    ...extra,
  });
}

const kveikDryHopped = (contactMin = 2880) =>
  doc('kveik', 32, {
    hops: [
      { name: 'Cascade', amountG: 30, alphaPct: 6, use: 'boil', timeMin: 60, form: 'pellet' },
      { name: 'Cascade', amountG: 60, alphaPct: 6, use: 'dry_hop', timeMin: contactMin, form: 'pellet' },
    ],
  } as Partial<RecipeDocument>);

const opts = (o: Record<string, unknown>) => planOptionsSchema.parse(o);

describe('fermentation and carbonation lengths', () => {
  it('kveik at 30–35 °C finishes in 2–4 days (Garshol, Historical Brewing Techniques, 2020; from memory)', () => {
    expect(fermentationDays('kveik', 32)).toMatchObject({ min: 2, max: 4 });
    expect(fermentationDays('kveik', 32).source).toMatch(/Garshol/);
  });
  it('a clean ale at 18 °C takes one to two weeks (Palmer, How to Brew, 2017; from memory)', () => {
    expect(fermentationDays('ale', 18)).toMatchObject({ min: 7, max: 14 });
    expect(fermentationDays('ale', 18).source).toMatch(/Palmer/);
  });
  it('primed bottles carbonate in about two weeks at room temperature (Palmer, How to Brew, 2017; from memory)', () => {
    expect(carbonationDays('bottle')).toMatchObject({ typical: 14 });
    expect(carbonationDays('bottle').source).toMatch(/Palmer/);
  });
  it('a lager takes longer than an ale (common practice)', () => {
    expect(fermentationDays('lager', 10).min).toBeGreaterThan(fermentationDays('ale', 18).min);
  });
  it('set-and-forget takes about 1–2 weeks, a burst 1–3 days (common practice)', () => {
    expect(carbonationDays('set_and_forget')).toMatchObject({ min: 7, max: 14 });
    expect(carbonationDays('burst')).toMatchObject({ min: 1, max: 3 });
    expect(carbonationDays('spunding').typical).toBeLessThan(carbonationDays('burst').typical);
  });
});

describe('every length in a plan says where it comes from', () => {
  const NAMED = /^(common practice|Palmer, How to Brew|Garshol, Historical Brewing Techniques)/;
  it('each fermentation range, for every yeast kind and temperature, names a source or common practice', () => {
    for (const kind of YEAST_KINDS)
      for (let tempC = 0; tempC <= 40; tempC += 1) expect(fermentationDays(kind, tempC).source).toMatch(NAMED);
  });
  it('each carbonation method names a source or common practice', () => {
    for (const method of ['set_and_forget', 'burst', 'spunding', 'bottle'] as const)
      expect(carbonationDays(method).source).toMatch(NAMED);
  });
  it('every timed event of a full plan carries its source (common practice for crash and dry hop)', () => {
    const plan = planBrew(
      kveikDryHopped(),
      opts({ pourOn: '2026-12-30', carbonation: 'spunding', dryHopIn: 'fermenter', crash: true }),
      '2026-12-02',
    );
    const timed = plan.events.filter((e) => ['ferment', 'dry_hop', 'spunding', 'crash', 'carbonate'].includes(e.kind));
    expect(timed.map((e) => e.kind)).toEqual(expect.arrayContaining(['ferment', 'dry_hop', 'crash', 'carbonate']));
    for (const e of timed) expect(e.source).toMatch(NAMED);
    expect(plan.events.find((e) => e.kind === 'crash')?.source).toMatch(/^common practice/);
    expect(plan.events.find((e) => e.kind === 'dry_hop')?.source).toBe('common practice');
  });
});

describe('planBrew', () => {
  it('makes the five-day kveik plan: dry hop in the keg, spunding, no crash', () => {
    const plan = planBrew(
      kveikDryHopped(),
      opts({ pourOn: '2026-12-08', carbonation: 'spunding', dryHopIn: 'keg', crash: false }),
      '2026-12-02',
    );
    // 3 days of kveik at 32 °C + 1 day to chill and top up the spunded keg.
    expect(plan.totalDays).toBe(4);
    expect(plan.shortfallDays).toBe(0);
    expect(plan.brewOn).toBe('2026-12-04');
    expect(plan.readyOn).toBe('2026-12-08');
    const kinds = plan.events.map((e) => e.kind);
    expect(kinds).toEqual(['brew', 'ferment', 'spunding', 'package', 'carbonate', 'pour']);
    expect(plan.events.find((e) => e.kind === 'spunding')?.caution).toMatch(/rated pressure/);
    expect(plan.events.find((e) => e.kind === 'package')?.detail).toMatch(/dry hops in the keg/);
  });

  it('brews as late as the date allows and never before today', () => {
    const plan = planBrew(doc('ale', 18), opts({ pourOn: '2026-12-30', carbonation: 'burst' }), '2026-12-02');
    // 10 days of ale + 2 of crash + 2 of burst carbonation.
    expect(plan.totalDays).toBe(14);
    expect(plan.brewOn).toBe('2026-12-16');
    expect(plan.shortfallDays).toBe(0);
  });

  it('reports the shortfall of an impossible date and what would close it', () => {
    const plan = planBrew(doc('ale', 18), opts({ pourOn: '2026-12-08', carbonation: 'set_and_forget' }), '2026-12-02');
    // Today + 10 + 2 + 10 = 2026-12-24: 16 days after the 8th.
    expect(plan.brewOn).toBe('2026-12-02');
    expect(plan.readyOn).toBe('2026-12-24');
    expect(plan.shortfallDays).toBe(16);
    expect(plan.summary).toMatch(/16 days late/);
    const changes = plan.suggestions.map((s) => s.change).join(' | ');
    expect(changes).toMatch(/kveik/);
    expect(changes).toMatch(/Spund/);
    expect(plan.suggestions.find((s) => /Spund/.test(s.change))?.savesDays).toBe(9);
  });

  it('names a hotter kveik ferment and dry hopping in the keg for a slow kveik plan', () => {
    // Four days of dry-hop contact: two more than the last two days of fermentation hold.
    const plan = planBrew(
      kveikDryHopped(4 * 1440),
      opts({ pourOn: '2026-12-05', fermentTempC: 24, carbonation: 'burst' }),
      '2026-12-02',
    );
    expect(plan.shortfallDays).toBeGreaterThan(0);
    const changes = plan.suggestions.map((s) => s.change);
    expect(changes.some((c) => /hotter/.test(c))).toBe(true);
    expect(changes.some((c) => /in the keg/.test(c))).toBe(true);
  });

  it('refuses a pour date in the past and one before the brew date', () => {
    const d = doc('kveik', 32);
    expect(() => planBrew(d, opts({ pourOn: '2026-12-01', carbonation: 'burst' }), '2026-12-02')).toThrow(
      PlanDateError,
    );
    try {
      planBrew(d, opts({ pourOn: '2026-12-10', brewOn: '2026-12-12', carbonation: 'burst' }), '2026-12-02');
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(PlanDateError);
      expect((e as PlanDateError).field).toBe('pourOn');
      expect((e as Error).message).toMatch(/before the brew date/);
    }
    expect(planOptionsSchema.safeParse({ pourOn: '2026-02-30', carbonation: 'burst' }).success).toBe(false);
  });

  it('counts forward from a given brew date', () => {
    const plan = planBrew(
      doc('lager', 10),
      opts({ pourOn: '2027-01-31', brewOn: '2026-12-05', carbonation: 'set_and_forget' }),
      '2026-12-02',
    );
    expect(plan.brewOn).toBe('2026-12-05');
    expect(plan.readyOn).toBe('2027-01-07'); // 21 + 2 + 10 days
  });
});

describe('planToIcs', () => {
  it('writes a valid calendar with one all-day event per step', () => {
    const plan = planBrew(
      kveikDryHopped(),
      opts({ pourOn: '2026-12-08', carbonation: 'spunding', dryHopIn: 'keg', crash: false }),
      '2026-12-02',
    );
    const text = planToIcs(plan, { title: 'Garage Kveik', url: 'http://127.0.0.1/x', uidBase: 'abc' });
    const lines = text
      .replace(/\r\n[ \t]/g, '')
      .split('\r\n')
      .filter(Boolean);
    expect(lines[0]).toBe('BEGIN:VCALENDAR');
    expect(lines.at(-1)).toBe('END:VCALENDAR');
    expect(lines).toContain('VERSION:2.0');
    const events = lines.filter((l) => l === 'BEGIN:VEVENT').length;
    expect(events).toBe(plan.events.length);
    expect(lines.filter((l) => l === 'END:VEVENT').length).toBe(events);
    expect(lines).toContain('DTSTART;VALUE=DATE:20261204');
    expect(lines.filter((l) => l.startsWith('UID:')).length).toBe(events);
  });
});
