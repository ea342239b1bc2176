/*
 * The shop's currencies and money helpers, shared by the server and the app (docs/api.md, "Shop").
 * Prices travel and are stored in minor units (cents, pence, yen).
 */

/** Currencies a shop may sell in (ISO 4217 codes, lower-case as the API writes them). */
export const SHOP_CURRENCIES = ['usd', 'eur', 'gbp', 'cad', 'aud', 'nzd', 'chf', 'sek', 'nok', 'dkk', 'jpy'] as const;
export type ShopCurrency = (typeof SHOP_CURRENCIES)[number];

/**
 * Digits after the decimal point of each shop currency: 2 for most, 0 for the yen
 * (ISO 4217 minor-unit column).
 */
export const MINOR_DIGITS: Record<ShopCurrency, number> = {
  usd: 2, eur: 2, gbp: 2, cad: 2, aud: 2, nzd: 2, chf: 2, sek: 2, nok: 2, dkk: 2, jpy: 0,
};

/** Names shown beside the codes in the currency picker. */
export const CURRENCY_NAMES: Record<ShopCurrency, string> = {
  usd: 'US dollar', eur: 'Euro', gbp: 'Pound sterling', cad: 'Canadian dollar', aud: 'Australian dollar',
  nzd: 'New Zealand dollar', chf: 'Swiss franc', sek: 'Swedish krona', nok: 'Norwegian krone', dkk: 'Danish krone', jpy: 'Japanese yen',
};

/** Lowest price accepted, in minor units (the payment provider refuses very small charges; from memory, 50 cents in USD). */
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

/** What one minor unit is called, for the price field's hint. */
export function minorUnitName(currency: ShopCurrency): string {
  if (currency === 'jpy') return 'yen';
  if (currency === 'gbp') return 'pence';
  if (currency === 'sek' || currency === 'nok' || currency === 'dkk') return 'öre';
  if (currency === 'chf') return 'centimes';
  return 'cents';
}

/**
 * A price as typed in the currency's own units ("12.50", "12.5", "12", "1,500" for yen) to minor units,
 * read digit by digit from the text: no floating-point step, so "0.29" is 29 and "19.99" is 1999. Null
 * when the text is not a plain amount or has more decimals than the currency (a third digit of cents).
 */
export function parseMoney(text: string, currency: ShopCurrency): number | null {
  const digits = MINOR_DIGITS[currency];
  const m = /^(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d*))?$/.exec(text.trim());
  if (!m) return null;
  const whole = m[1].replace(/,/g, '');
  const fraction = m[2] ?? '';
  if (fraction.length > digits) return null;
  const minor = Number(whole + fraction.padEnd(digits, '0'));
  return Number.isSafeInteger(minor) ? minor : null;
}

/** Minor units as a plain amount in the currency's units for a price field: 1250 usd → "12.50", 1500 jpy → "1500". */
export function formatMoneyAmount(minor: number, currency: ShopCurrency): string {
  const digits = MINOR_DIGITS[currency];
  if (digits === 0) return String(minor);
  const text = String(Math.abs(minor)).padStart(digits + 1, '0');
  return `${minor < 0 ? '-' : ''}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}
