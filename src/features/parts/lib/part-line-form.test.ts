import { describe, expect, it } from 'vitest';
import { chapterStartFor, changedInput, emptyPartLineValues, valuesToInput } from './part-line-form';

const base = emptyPartLineValues('EUR', { description: 'Seal kit', unitPrice: '14.40' });

describe('valuesToInput', () => {
  it('turns typed money into minor units of the line’s currency and the percent into basis points', () => {
    const r = valuesToInput({ ...base, taxRate: '20', quantity: '2.5' }, 'EUR');
    expect(r.ok && r.input).toMatchObject({ unitPriceMinor: 1440, taxRateBp: 2000, quantity: '2.5', currency: 'EUR', fxRate: null });
    // ISO 4217: the yen has no minor unit, the Kuwaiti dinar three.
    const yen = valuesToInput({ ...base, currency: 'jpy', unitPrice: '1500', fxRate: '0.0062' }, 'EUR');
    expect(yen.ok && yen.input).toMatchObject({ unitPriceMinor: 1500, currency: 'JPY', fxRate: '0.0062' });
    const kwd = valuesToInput({ ...base, currency: 'KWD', unitPrice: '1.234', fxRate: '3' }, 'EUR');
    expect(kwd.ok && kwd.input.unitPriceMinor).toBe(1234);
  });

  it('names the cell of each problem', () => {
    const r = valuesToInput({ ...base, description: ' ', unitPrice: '1.234', taxRate: '120', currency: 'GBP' }, 'EUR');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(Object.keys(r.errors).sort()).toEqual(['description', 'fxRate', 'taxRate', 'unitPrice']);
    const typedSupplier = valuesToInput({ ...base, supplierName: 'Ostry Fasteners' }, 'EUR');
    expect(!typedSupplier.ok && typedSupplier.errors.supplierName).toMatch(/pick a supplier/);
  });

  it('drops fields that do not apply (avoided cost of a bought line, open item of a fitted one)', () => {
    const r = valuesToInput({ ...base, avoidedCost: '5', openItemId: '3', status: 'fitted' }, 'EUR');
    expect(r.ok && r.input).toMatchObject({ avoidedCostMinor: null, openItemId: null });
    const reused = valuesToInput({ ...base, source: 'reused', avoidedCost: '5', openItemId: '3', status: 'on-order' }, 'EUR');
    expect(reused.ok && reused.input).toMatchObject({ avoidedCostMinor: 500, openItemId: 3 });
  });

  it('keeps the moment of a line between chapters unless a chapter is chosen', () => {
    expect(chapterStartFor(100, [0, 95, 300])).toBe(95);
    expect(chapterStartFor(null, [0])).toBeNull();
    const kept = valuesToInput({ ...base, chapter: '' }, 'EUR', 123);
    expect(kept.ok && kept.input.atSeconds).toBe(123);
    const chosen = valuesToInput({ ...base, chapter: '95' }, 'EUR', 123);
    expect(chosen.ok && chosen.input.atSeconds).toBe(95);
  });

  it('sends only the changed fields', () => {
    const a = valuesToInput(base, 'EUR');
    const b = valuesToInput({ ...base, quantity: '3' }, 'EUR');
    expect(a.ok && b.ok && changedInput(a.input, b.input)).toEqual({ quantity: '3' });
  });
});
