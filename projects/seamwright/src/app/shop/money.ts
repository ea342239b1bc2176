import type { ShopCurrency } from './shop-types';

/** Digits after the decimal point per currency (ISO 4217 minor units): 2, or 0 for the yen. */
export const MINOR_DIGITS: Record<ShopCurrency, number> = {
  usd: 2, eur: 2, gbp: 2, cad: 2, aud: 2, nzd: 2, chf: 2, sek: 2, nok: 2, dkk: 2, jpy: 0,
};

/** Names shown beside the codes in the currency picker. */
export const CURRENCY_NAMES: Record<ShopCurrency, string> = {
  usd: 'US dollar', eur: 'Euro', gbp: 'Pound sterling', cad: 'Canadian dollar', aud: 'Australian dollar',
  nzd: 'New Zealand dollar', chf: 'Swiss franc', sek: 'Swedish krona', nok: 'Norwegian krone', dkk: 'Danish krone', jpy: 'Japanese yen',
};

/** Lowest and highest prices the server takes, in minor units. */
export const MIN_PRICE_MINOR = 50;
export const MAX_PRICE_MINOR = 99_999_999;

/** Minor units as money text: 1250 usd → "$12.50", 1500 jpy → "¥1,500". */
export function formatMoney(minor: number, currency: ShopCurrency, locale = 'en-US'): string {
  const digits = MINOR_DIGITS[currency];
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency: currency.toUpperCase(),
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(minor / 10 ** digits);
}

/** What one minor unit is called, for the price field's hint. */
export function minorUnitName(currency: ShopCurrency): string {
  if (currency === 'jpy') return 'yen';
  if (currency === 'gbp') return 'pence';
  if (currency === 'sek' || currency === 'nok' || currency === 'dkk') return 'öre';
  if (currency === 'chf') return 'centimes';
  return 'cents';
}
