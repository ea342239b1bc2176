import type { ShopCurrency } from '../db/schema';

/**
 * Digits after the decimal point of each shop currency: 2 for most, 0 for the yen
 * (ISO 4217 minor-unit column). Prices are stored in minor units (cents, pence, yen).
 */
export const MINOR_DIGITS: Record<ShopCurrency, number> = {
  usd: 2, eur: 2, gbp: 2, cad: 2, aud: 2, nzd: 2, chf: 2, sek: 2, nok: 2, dkk: 2, jpy: 0,
};

/** Lowest price accepted, in minor units (the provider refuses very small charges; from memory, 50 cents in USD). */
export const MIN_PRICE_MINOR = 50;
/** Highest price accepted, in minor units (the provider's amount field holds at most 8 digits; from memory). */
export const MAX_PRICE_MINOR = 99_999_999;

/** Minor units as money text, e.g. 1250 usd → "$12.50", 1500 jpy → "¥1,500". */
export function formatMoney(minor: number, currency: ShopCurrency, locale = 'en-US'): string {
  const digits = MINOR_DIGITS[currency];
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency: currency.toUpperCase(),
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(minor / 10 ** digits);
}
