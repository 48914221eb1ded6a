import { describe, expect, it } from 'vitest';
import { ACID_MEQ_PER_ML } from './mash-ph';

/**
 * mEq of acid per mL at a mash pH, from the acid's strength by weight, its
 * density, molar mass and dissociation constants: each proton gives up the
 * share 1 / (1 + 10^(pKa − pH)) (Henderson–Hasselbalch). Densities and pKa
 * values from the CRC Handbook of Chemistry and Physics (from memory): lactic
 * acid 88 % 1.21 g/mL, pKa 3.86; phosphoric acid 10 % 1.053 g/mL, pKa 2.15 and
 * 7.20 (the third, 12.3, gives nothing at mash pH).
 */
function mEqPerMl(weightShare: number, densityGPerMl: number, molarMassG: number, pKas: number[], ph: number) {
  const mmolPerMl = ((weightShare * densityGPerMl) / molarMassG) * 1000;
  return mmolPerMl * pKas.reduce((sum, pKa) => sum + 1 / (1 + 10 ** (pKa - ph)), 0);
}

describe('acid strengths used for the mash', () => {
  // IUPAC atomic weights: lactic acid C3H6O3 90.08 g/mol, phosphoric acid H3PO4 97.99 g/mol.
  it('agree within 10 % with the chemistry at a mash pH of 5.2–5.6', () => {
    for (const ph of [5.2, 5.4, 5.6]) {
      const lactic = mEqPerMl(0.88, 1.21, 90.08, [3.86], ph);
      const phosphoric = mEqPerMl(0.1, 1.053, 97.99, [2.15, 7.2], ph);
      expect(Math.abs(ACID_MEQ_PER_ML.lactic_88 / lactic - 1)).toBeLessThan(0.1);
      expect(Math.abs(ACID_MEQ_PER_ML.phosphoric_10 / phosphoric - 1)).toBeLessThan(0.1);
    }
  });
});
