import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const PROJECT_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const EXAMPLE_PATH = fileURLToPath(new URL('./examples/pale-ale.json', import.meta.url));

/** Runs `scripts/calc.ts` under tsx with `input` on stdin. */
function runCalc(input: string, args: string[] = []) {
  return spawnSync(process.execPath, ['--import', 'tsx', 'scripts/calc.ts', ...args], {
    cwd: PROJECT_ROOT,
    input,
    encoding: 'utf8',
    timeout: 30_000,
  });
}

describe('scripts/calc.ts', () => {
  it('prints the stats of a valid recipe as JSON', () => {
    const result = runCalc(readFileSync(EXAMPLE_PATH, 'utf8'));
    expect(result.status, result.stderr).toBe(0);
    const stats = JSON.parse(result.stdout);
    expect(stats.og).toBeGreaterThan(1.04);
    expect(stats.hops).toHaveLength(4);
    expect(stats.styleFit.code).toBe('18B');
  });

  it('exits with status 2 on input that is not JSON', () => {
    const result = runCalc('{ not json');
    expect(result.status).toBe(2);
    expect(result.stderr).toMatch(/not valid JSON/);
    expect(result.stdout).toBe('');
  });

  it('exits with status 2 and names each bad field on its own line', () => {
    const doc = JSON.parse(readFileSync(EXAMPLE_PATH, 'utf8'));
    doc.hops[2].alphaPct = 45;
    doc.batch.volumeL = 0;
    const result = runCalc(JSON.stringify(doc));
    expect(result.status).toBe(2);
    const lines = result.stderr.trim().split('\n');
    expect(lines).toContain('hops.2.alphaPct: Alpha acid must be at most 30%');
    expect(lines).toContain('batch.volumeL: Batch volume must be at least 0.1 L');
    expect(lines).toHaveLength(2);
  });

  // A homebrewer's built water solved backwards (see water.test.ts), the measured 5.33 (fact of the trade),
  // 15 psi at 85 °F → about 1.3 volumes (force-carbonation tables solved for volumes).
  it('prints the salt plan, predicted mash pH and spunding volumes for a document that carries them', () => {
    const doc = JSON.parse(readFileSync(EXAMPLE_PATH, 'utf8'));
    doc.fermentables = [{ name: 'Pale ale malt', amountKg: 5.5, potentialPpg: 38, colorLovibond: 3, kind: 'grain' }];
    doc.batch.mashWaterLPerKg = 5.5;
    doc.water = {
      volumeL: 30.28,
      source: { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 },
      salts: [
        { salt: 'gypsum', grams: 5 },
        { salt: 'epsom', grams: 3 },
        { salt: 'table_salt', grams: 3 },
        { salt: 'calcium_chloride', grams: 10 },
      ],
      target: { calcium: 128, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 },
    };
    doc.fermentation.spunding = { pressureKPa: 103.4, tempC: 29.4 };
    const result = runCalc(JSON.stringify(doc));
    expect(result.status, result.stderr).toBe(0);
    const stats = JSON.parse(result.stdout);
    const grams = Object.fromEntries(
      stats.water.plan.salts.map((s: { salt: string; grams: number }) => [s.salt, s.grams]),
    );
    expect(grams.gypsum).toBeCloseTo(5, 0);
    expect(grams.calcium_chloride).toBeCloseTo(10, 0);
    expect(stats.water.plan.rmsErrorMgPerL).toBeLessThan(2);
    expect(Math.abs(stats.mash.predictedPh - 5.33)).toBeLessThan(0.1);
    expect(Math.abs(stats.carbonation.spundingVolumesCO2 - 1.3)).toBeLessThan(0.05);
  });

  // Common practice: a hotter main rest leaves a higher FG, degree by degree.
  it('moves fg continuously with the main rest temperature', () => {
    const fgAt = (tempC: number) => {
      const doc = JSON.parse(readFileSync(EXAMPLE_PATH, 'utf8'));
      doc.mash.steps = [{ tempC, timeMin: 60 }];
      return JSON.parse(runCalc(JSON.stringify(doc)).stdout).fg as number;
    };
    expect(fgAt(65)).toBeLessThan(fgAt(66));
    expect(fgAt(66)).toBeLessThan(fgAt(67));
  });

  it('fits the recipe to another brewhouse with --scale and prints the document and its stats', () => {
    const text = readFileSync(EXAMPLE_PATH, 'utf8');
    const before = JSON.parse(runCalc(text).stdout);
    const result = runCalc(text, ['--scale', '{"volumeL":40,"efficiencyPct":65}']);
    expect(result.status, result.stderr).toBe(0);
    const { document, stats } = JSON.parse(result.stdout);
    expect(document.batch).toMatchObject({ volumeL: 40, efficiencyPct: 65 });
    expect(Math.abs(stats.og - before.og)).toBeLessThan(0.0005);
    expect(Math.abs(stats.ibu - before.ibu)).toBeLessThan(0.5);
    expect(Math.abs(stats.srm - before.srm)).toBeLessThan(0.25);
  });

  it('refuses a negative target ion, an impossible spunding pressure and a scale volume of 0', () => {
    const doc = JSON.parse(readFileSync(EXAMPLE_PATH, 'utf8'));
    doc.water.target = { calcium: -5, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 };
    doc.fermentation.spunding = { pressureKPa: 900, tempC: 20 };
    const bad = runCalc(JSON.stringify(doc));
    expect(bad.status).toBe(2);
    const lines = bad.stderr.trim().split('\n');
    expect(lines).toContain('water.target.calcium: Calcium cannot be negative');
    expect(
      lines.some((line) => line.startsWith('fermentation.spunding.pressureKPa: Spunding pressure must be at most')),
    ).toBe(true);
    expect(lines).toHaveLength(2);
    const zero = runCalc(readFileSync(EXAMPLE_PATH, 'utf8'), ['--scale', '{"volumeL":0}']);
    expect(zero.status).toBe(2);
    expect(zero.stderr.trim()).toBe('scale.volumeL: Scale volume must be at least 0.1 L');
  });
});
