/*
 * The shop's money rules live in the API contract, shared with the app; the server's shop code keeps
 * importing them from here.
 */
export { formatMoney, MAX_PRICE_MINOR, MIN_PRICE_MINOR, MINOR_DIGITS } from '@seamwright/api';
