/*
 * Shapes of the shop API's answers (docs/api.md, "Shop"). Prices are in minor units (cents, pence, yen).
 */
import type { PatternAccess } from '../core/api-types';

/** Currencies a shop may sell in (ISO 4217 codes, lower-case as the API writes them). */
export const SHOP_CURRENCIES = ['usd', 'eur', 'gbp', 'cad', 'aud', 'nzd', 'chf', 'sek', 'nok', 'dkk', 'jpy'] as const;
export type ShopCurrency = (typeof SHOP_CURRENCIES)[number];

export interface Listing {
  patternId: string;
  title: string;
  description: string;
  priceMinor: number;
  currency: ShopCurrency;
  designer: { id: string; displayName: string };
  published: boolean;
  publishedAt: string | null;
  sectionCount: number;
  finishedSize: { widthIn: number; heightIn: number } | null;
  /** The viewer's access to the pattern; null until bought or shared. */
  access: PatternAccess | null;
}

export type OrderStatus = 'pending' | 'paid' | 'refunded' | 'expired';

export interface Order {
  id: string;
  patternId: string | null;
  patternTitle: string;
  amountMinor: number;
  currency: ShopCurrency;
  status: OrderStatus;
  refundRequested: boolean;
  createdAt: string;
  paidAt: string | null;
  refundedAt: string | null;
  receiptSent: boolean;
  buyer?: { id: string; displayName: string; email: string };
  seller?: { id: string; displayName: string };
}

export interface SalesPage {
  items: Order[];
  total: number;
  page: number;
  pageSize: number;
  totals: { currency: ShopCurrency; orders: number; amountMinor: number }[];
}

export interface ListingSettings {
  priceMinor: number;
  description: string;
  published: boolean;
  publishedAt: string | null;
  updatedAt: string;
}

/** The signed-in designer's shop: its currency and every pattern they own. */
export interface MyShop {
  shop: { currency: ShopCurrency } | null;
  patterns: { patternId: string; title: string; paidOrders: number; listing: ListingSettings | null }[];
}

export interface ListingBody {
  priceMinor: number;
  description: string;
  published: boolean;
}
