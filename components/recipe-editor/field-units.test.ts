import { describe, expect, it } from 'vitest';
import { DAYS_FROM_MINUTES, fieldUnit, formatForInput, parseTyped, plainUnit } from './field-units';

describe('fieldUnit', () => {
  it('shows metric values as stored', () => {
    const kg = fieldUnit('mass', 'metric');
    expect(kg.label).toBe('kg');
    expect(formatForInput(4.2, kg)).toBe('4.2');
    expect(parseTyped('4.2', kg)).toBe(4.2);
  });

  it('shows US units and stores metric', () => {
    const lb = fieldUnit('mass', 'us');
    expect(lb.label).toBe('lb');
    expect(parseTyped('10', lb)).toBeCloseTo(4.53592, 5);
    expect(formatForInput(4.5359237, lb)).toBe('10');
    const oz = fieldUnit('hopMass', 'us');
    expect(parseTyped('1', oz)).toBeCloseTo(28.3495, 3);
    const gal = fieldUnit('volume', 'us');
    expect(formatForInput(18.92705892, gal)).toBe('5');
  });

  it('converts temperatures as points on the scale, not differences', () => {
    const f = fieldUnit('temperature', 'us');
    expect(formatForInput(66, f)).toBe('150.8');
    expect(parseTyped('152', f)).toBeCloseTo(66.6667, 3);
  });

  it('converts mash thickness to quarts per pound', () => {
    const thickness = fieldUnit('litresPerKg', 'us');
    expect(thickness.label).toBe('qt per lb');
    expect(formatForInput(3, thickness)).toBe('1.44');
    expect(parseTyped('1.5', thickness)).toBeCloseTo(3.13, 2);
  });

  it('round-trips any value typed at display precision', () => {
    for (const quantity of ['mass', 'hopMass', 'volume', 'temperature', 'litresPerKg'] as const) {
      const unit = fieldUnit(quantity, 'us');
      for (const typed of ['1', '12.5', '150.2']) {
        expect(formatForInput(parseTyped(typed, unit), unit)).toBe(String(Number(typed)));
      }
    }
  });

  it('shows dry-hop minutes as days', () => {
    expect(formatForInput(4320, DAYS_FROM_MINUTES)).toBe('3');
    expect(parseTyped('2.5', DAYS_FROM_MINUTES)).toBe(3600);
  });
});

describe('parseTyped', () => {
  const percent = plainUnit('%', 1);

  it('reads empty text as no value', () => {
    expect(parseTyped('  ', percent)).toBeNull();
  });

  it('reads a decimal comma', () => {
    expect(parseTyped('5,5', percent)).toBe(5.5);
  });

  it('reads unfinished or wrong text as not a number', () => {
    expect(parseTyped('abc', percent)).toBeNaN();
    expect(parseTyped('1.2.3', percent)).toBeNaN();
    expect(parseTyped('-', percent)).toBeNaN();
  });

  it('accepts a trailing point while typing', () => {
    expect(parseTyped('12.', percent)).toBe(12);
  });
});
