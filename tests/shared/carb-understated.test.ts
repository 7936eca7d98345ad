import { carbUnderstated } from '../../shared/compute/batch';

describe('carbUnderstated', () => {
  it.each([
    { name: 'available known and complete', totals: { carbAvailable: 50, carbTotal: 60 }, incomplete: [], basis: 'available', out: false },
    { name: 'available is a partial sum', totals: { carbAvailable: 50, carbTotal: 60 }, incomplete: ['carbAvailable'], basis: 'available', out: true },
    { name: 'only total is partial, counting available', totals: { carbAvailable: 50, carbTotal: 60 }, incomplete: ['carbTotal'], basis: 'available', out: false },
    { name: 'available derived from a partial total', totals: { carbAvailable: null, carbTotal: 60 }, incomplete: ['carbTotal'], basis: 'available', out: true },
    { name: 'available derived with partial fibre', totals: { carbAvailable: null, carbTotal: 60 }, incomplete: ['fibre'], basis: 'available', out: true },
    { name: 'total is a partial sum', totals: { carbAvailable: 50, carbTotal: 60 }, incomplete: ['carbTotal'], basis: 'total', out: true },
    { name: 'total derived from a partial available', totals: { carbAvailable: 50, carbTotal: null }, incomplete: ['carbAvailable'], basis: 'total', out: true },
    { name: 'only sugars are partial', totals: { carbAvailable: 50, carbTotal: 60 }, incomplete: ['sugars'], basis: 'total', out: false },
  ] as const)('$name → $out', ({ totals, incomplete, basis, out }) => {
    expect(carbUnderstated(totals, incomplete, basis)).toBe(out);
  });
});
