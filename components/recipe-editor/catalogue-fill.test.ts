import { describe, expect, it } from 'vitest';
import { fermentableFill, hopFill, yeastFill } from './catalogue-fill';

describe('catalogue fill', () => {
  it('fills a malt’s potential, colour and kind, ignoring case and spaces', () => {
    expect(fermentableFill('  munich MALT ')).toEqual({ potentialPpg: 35, colorLovibond: 10, kind: 'grain' });
  });

  it('fills a hop’s alpha acid from the middle of its range', () => {
    expect(hopFill('Cascade')).toEqual({ alphaPct: 5.8 });
  });

  it('fills a yeast kind’s attenuation and temperatures', () => {
    expect(yeastFill('Clean ale yeast')).toEqual({ kind: 'ale', attenuationPct: 76.5, tempMinC: 15, tempMaxC: 22 });
  });

  it('fills nothing for a name outside the catalogue', () => {
    expect(fermentableFill('Smoked oak malt')).toBeNull();
    expect(hopFill('Cascad')).toBeNull();
    expect(yeastFill('')).toBeNull();
  });
});
