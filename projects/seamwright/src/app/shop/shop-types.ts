/*
 * Shapes of the shop API's answers: types inferred from the shared contract (@seamwright/api;
 * docs/api.md, "Shop"). Prices are in minor units (cents, pence, yen).
 */
export {
  SHOP_CURRENCIES,
  type ListingBody,
  type Listing,
  type ListingSettings,
  type MyShop,
  type Order,
  type OrderStatus,
  type SalesPage,
  type ShopCurrency,
} from '@seamwright/api';
