import { z } from 'zod';

/**
 * A member's brewhouse beyond batch volume and efficiency: the losses a recipe
 * fitted to it takes, and the report of the water they brew with. Every field
 * may be left unset; a fit then keeps the recipe's own value.
 */

function optionalNumber(label: string, min: number, max: number, unit: string) {
  return z
    .number({ error: `${label} must be a number` })
    .min(min, `${label} must be at least ${min} ${unit}`)
    .max(max, `${label} must be at most ${max} ${unit}`)
    .nullable();
}

function ion(label: string) {
  return z
    .number({ error: `${label} must be a number of mg/L` })
    .min(0, `${label} cannot be negative`)
    .max(2000, `${label} must be at most 2000 mg/L`);
}

const waterReportSchema = z.object(
  {
    name: z
      .string({ error: 'Give the water a name' })
      .trim()
      .min(1, 'Give the water a name, e.g. "Tap water, spring 2026"')
      .max(80, 'Keep the water’s name under 80 characters'),
    calcium: ion('Calcium'),
    magnesium: ion('Magnesium'),
    sodium: ion('Sodium'),
    chloride: ion('Chloride'),
    sulfate: ion('Sulfate'),
    bicarbonate: ion('Bicarbonate'),
  },
  { error: 'The water report must be an object' },
);

// Bounds as the recipe document's batch fields have them (lib/brewing/schema.ts).
export const brewhouseSchema = z.object(
  {
    boilOffLPerHour: optionalNumber('Boil-off rate', 0, 100, 'L per hour'),
    trubLossL: optionalNumber('Kettle trub loss', 0, 500, 'L'),
    grainAbsorptionLPerKg: optionalNumber('Grain absorption', 0, 3, 'L per kg'),
    mashWaterLPerKg: optionalNumber('Mash thickness', 1, 10, 'L per kg'),
    waterReport: waterReportSchema.nullable(),
  },
  { error: 'The brewhouse must be an object' },
);

export type BrewhouseInput = z.infer<typeof brewhouseSchema>;

export const EMPTY_BREWHOUSE: BrewhouseInput = {
  boilOffLPerHour: null,
  trubLossL: null,
  grainAbsorptionLPerKg: null,
  mashWaterLPerKg: null,
  waterReport: null,
};

/** The brewhouse a recipe is fitted to: settings' batch volume and efficiency with the losses and water report. */
export interface MemberBrewhouse extends BrewhouseInput {
  batchVolumeL: number;
  efficiencyPct: number;
}
