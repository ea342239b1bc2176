/*
 * The price field of a listing: typed in the currency's own units ("12.50", "1,500" for yen) and read
 * into minor units with the API's money helpers, digit by digit (never through floating point).
 */
import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { MAX_PRICE_MINOR, MIN_PRICE_MINOR, MINOR_DIGITS, formatMoney, formatMoneyAmount, parseMoney, type ShopCurrency } from '@seamwright/api';

/** An example amount to type in `currency`: "12.50", or "1500" for the yen. */
export function priceExample(currency: ShopCurrency): string {
  return formatMoneyAmount(MINOR_DIGITS[currency] === 0 ? 1500 : 1250, currency);
}

/** What is wrong with a typed price in `currency`, or null when it can be sent. */
export function priceProblem(text: string, currency: ShopCurrency): string | null {
  if (!text.trim()) return 'A price is required';
  const minor = parseMoney(text, currency);
  if (minor === null) {
    return MINOR_DIGITS[currency] === 0
      ? `Type a whole amount, e.g. ${priceExample(currency)}`
      : `Type an amount with at most ${MINOR_DIGITS[currency]} decimals, e.g. ${priceExample(currency)}`;
  }
  if (minor < MIN_PRICE_MINOR) return `At least ${formatMoney(MIN_PRICE_MINOR, currency)}`;
  if (minor > MAX_PRICE_MINOR) return `At most ${formatMoney(MAX_PRICE_MINOR, currency)}`;
  return null;
}

/** A validator of the price text in the currency `currency()` gives at the time of the check. */
export function priceValidator(currency: () => ShopCurrency): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const problem = priceProblem(control.value ?? '', currency());
    return problem ? { price: problem } : null;
  };
}
