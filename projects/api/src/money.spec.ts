import { describe, expect, it } from 'vitest';
import { formatMoney, MINOR_DIGITS, minorUnitName, SHOP_CURRENCIES } from './money';

describe('formatMoney', () => {
  it('reads minor units with the currency’s own decimals', () => {
    // ISO 4217 minor units: 2 for USD, EUR, GBP; 0 for JPY.
    expect(formatMoney(1250, 'usd')).toBe('$12.50');
    expect(formatMoney(1250, 'eur')).toBe('€12.50');
    expect(formatMoney(50, 'gbp')).toBe('£0.50');
    expect(formatMoney(1500, 'jpy')).toBe('¥1,500');
  });

  it('knows the decimals of every shop currency', () => {
    expect(SHOP_CURRENCIES.filter((c) => MINOR_DIGITS[c] !== 2)).toEqual(['jpy']);
  });

  it('names the minor unit for the price hint', () => {
    expect(minorUnitName('jpy')).toBe('yen');
    expect(minorUnitName('gbp')).toBe('pence');
    expect(minorUnitName('usd')).toBe('cents');
  });
});
