import { describe, expect, it } from 'vitest';
import { formatMoney, formatMoneyAmount, MINOR_DIGITS, minorUnitName, parseMoney, SHOP_CURRENCIES } from './money';

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

describe('parseMoney and formatMoneyAmount', () => {
  it('reads a typed amount in the currency’s units exactly, without floating-point cents', () => {
    expect(parseMoney('12.50', 'usd')).toBe(1250);
    expect(parseMoney('12.5', 'usd')).toBe(1250);
    expect(parseMoney(' 12 ', 'eur')).toBe(1200);
    expect(parseMoney('12.', 'gbp')).toBe(1200);
    // 0.29 × 100 is 28.999999999999996 in floating point; 19.99 × 100 is 1998.9999999999998.
    expect(0.29 * 100).not.toBe(29);
    expect(parseMoney('0.29', 'usd')).toBe(29);
    expect(parseMoney('19.99', 'usd')).toBe(1999);
    expect(parseMoney('1,500', 'jpy')).toBe(1500);
    expect(parseMoney('1,234.56', 'usd')).toBe(123456);
  });

  it('refuses what is not a plain amount in the currency', () => {
    for (const bad of ['', '.5', '12.345', '-1', '1e3', '12,50', 'abc', '1,23', '0x10', '12.50 usd']) expect(parseMoney(bad, 'usd'), bad).toBeNull();
    // The yen has no minor unit (ISO 4217): no decimals at all.
    expect(parseMoney('1500.5', 'jpy')).toBeNull();
    expect(parseMoney('1500.', 'jpy')).toBe(1500);
  });

  it('writes minor units back as the amount a price field shows, and reads it back the same', () => {
    expect(formatMoneyAmount(1250, 'usd')).toBe('12.50');
    expect(formatMoneyAmount(5, 'usd')).toBe('0.05');
    expect(formatMoneyAmount(1500, 'jpy')).toBe('1500');
    for (const c of SHOP_CURRENCIES) for (const minor of [50, 99, 100, 1999, 99_999_999]) expect(parseMoney(formatMoneyAmount(minor, c), c)).toBe(minor);
  });
});
