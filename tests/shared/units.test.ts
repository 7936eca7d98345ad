import {
  carbUnitToGrams,
  formatCarb,
  formatGlucose,
  glucoseToMmol,
  gramsToCarbUnit,
  mgdlToMmol,
  mmolToMgdl,
} from '../../shared/compute/units';

describe('gramsToCarbUnit', () => {
  // check-values §6 / T22: 48 g = 4.8 CP (10 g) = 4.0 BE (12 g) = 3.2 exchanges (15 g).
  // Sources: UK NHS carbohydrate portion (10 g); German Diätverordnung BE (12 g);
  // Choose Your Foods: Exchange Lists for Diabetes, ADA/AND 2008 (15 g).
  it.each([
    { name: '48 g in grams', unit: 'g' as const, expected: 48 },
    { name: '48 g in 10 g portions', unit: 'portion10' as const, expected: 4.8 },
    { name: '48 g in 12 g units', unit: 'unit12' as const, expected: 4.0 },
    { name: '48 g in 15 g exchanges', unit: 'exchange15' as const, expected: 3.2 },
  ])('$name', ({ unit, expected }) => {
    expect(gramsToCarbUnit(48, unit)).toBeCloseTo(expected, 9);
  });

  it('round-trips through carbUnitToGrams', () => {
    expect(carbUnitToGrams(gramsToCarbUnit(37.3, 'exchange15'), 'exchange15')).toBeCloseTo(37.3, 9);
  });
});

describe('glucose unit conversion', () => {
  // check-values §5 / T19: factor 18.0156 from the molar mass of glucose (180.156 g/mol, IUPAC
  // conventional atomic weights — from memory per the reference file).
  it.each([
    { name: '126 mg/dL → 6.994 mmol/L', run: () => mgdlToMmol(126), expected: 6.994 },
    { name: '3.9 mmol/L → 70.26 mg/dL', run: () => mmolToMgdl(3.9), expected: 70.26 },
    { name: '10.0 mmol/L → 180.16 mg/dL', run: () => mmolToMgdl(10), expected: 180.16 },
    { name: '70 mg/dL → 3.886 mmol/L', run: () => mgdlToMmol(70), expected: 3.886 },
    { name: '54 mg/dL → 2.997 mmol/L', run: () => mgdlToMmol(54), expected: 2.997 },
  ])('$name', ({ run, expected }) => {
    expect(Math.abs(run() - expected)).toBeLessThan(0.01);
  });

  it('leaves mmol/L input unchanged and converts mg/dL input', () => {
    expect(glucoseToMmol(5.5, 'mmol_l')).toBe(5.5);
    expect(glucoseToMmol(180, 'mg_dl')).toBeCloseTo(9.991, 3);
  });
});

describe('formatCarb', () => {
  it.each([
    { name: 'whole grams from 10 g up', grams: 23.6, unit: 'g' as const, text: '24 g' },
    { name: 'tenths under 10 g', grams: 7.25, unit: 'g' as const, text: '7.3 g' },
    { name: 'exchanges to a tenth', grams: 48, unit: 'exchange15' as const, text: '3.2 ex' },
    { name: 'portions to a tenth', grams: 48, unit: 'portion10' as const, text: '4.8 CP' },
    { name: 'exactly 10 g is whole grams', grams: 10, unit: 'g' as const, text: '10 g' },
    { name: 'just under 10 g keeps a tenth', grams: 9.94, unit: 'g' as const, text: '9.9 g' },
    { name: 'bread units to a tenth', grams: 30, unit: 'unit12' as const, text: '2.5 BU' },
    { name: 'zero grams (an empty day) without a decimal', grams: 0, unit: 'g' as const, text: '0 g' },
    { name: 'a whole number under 10 g without ".0"', grams: 5, unit: 'g' as const, text: '5 g' },
    { name: 'under 10 g that rounds to a whole number', grams: 4.96, unit: 'g' as const, text: '5 g' },
    { name: 'a whole count of a counting unit', grams: 20, unit: 'portion10' as const, text: '2 CP' },
    { name: 'zero in a counting unit', grams: 0, unit: 'exchange15' as const, text: '0 ex' },
    { name: 'unknown grams', grams: null, unit: 'g' as const, text: 'unknown' },
    { name: 'unknown in a counting unit', grams: null, unit: 'portion10' as const, text: 'unknown' },
  ])('$name', ({ grams, unit, text }) => {
    // rounding rule from memory (EU label tolerance guidance pattern): ≥ 10 g whole, < 10 g one decimal, counting units one decimal,
    // no trailing ".0" on a value that rounds to a whole number (house rule, as for insulin units);
    // CP = 10 g, BU = 12 g, ex = 15 g as CARB_UNIT_GRAMS cites
    expect(formatCarb(grams, unit)).toBe(text);
  });

  it.each([
    { name: 'a counting unit with its grams', grams: 48, unit: 'exchange15' as const, text: '3.2 ex (48 g)' },
    { name: 'grams are not repeated', grams: 7.25, unit: 'g' as const, text: '7.3 g' },
    { name: 'unknown stays one word', grams: null, unit: 'unit12' as const, text: 'unknown' },
  ])('withGrams: $name', ({ grams, unit, text }) => {
    expect(formatCarb(grams, unit, { withGrams: true })).toBe(text);
  });
});

describe('formatGlucose', () => {
  it('shows mmol/L to one decimal and mg/dL whole', () => {
    expect(formatGlucose(3.886, 'mmol_l')).toBe('3.9 mmol/L');
    expect(formatGlucose(3.886, 'mg_dl')).toBe('70 mg/dL');
  });
});
