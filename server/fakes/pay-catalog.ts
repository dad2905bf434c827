/**
 * What the local payment provider sells and which test cards it knows. The card ids are the
 * ones the hosted provider accepts in test mode, with the same behaviour: `pm_card_visa` pays,
 * `pm_card_chargeCustomerFail` (…0341) can be saved but every charge fails, and
 * `pm_card_chargeDeclined` (…0002) is refused when it is attached.
 */
export interface TestCard {
  brand: string;
  last4: string;
  expMonth: number;
  expYear: number;
  /** Refused when attached to a customer. */
  attachFails: boolean;
  /** Attaches, but every charge is declined. */
  chargeFails: boolean;
}

export const TEST_CARDS: Record<string, TestCard> = {
  pm_card_visa: { brand: 'visa', last4: '4242', expMonth: 12, expYear: 2034, attachFails: false, chargeFails: false },
  pm_card_mastercard: { brand: 'mastercard', last4: '4444', expMonth: 11, expYear: 2033, attachFails: false, chargeFails: false },
  pm_card_chargeCustomerFail: { brand: 'visa', last4: '0341', expMonth: 10, expYear: 2032, attachFails: false, chargeFails: true },
  pm_card_chargeDeclined: { brand: 'visa', last4: '0002', expMonth: 9, expYear: 2031, attachFails: true, chargeFails: true },
};

export interface CatalogPrice {
  id: string;
  productId: string;
  productName: string;
  lookupKey: string;
  currency: string;
  /** Minor units (cents) per seat per interval. */
  unitAmount: number;
  interval: 'month' | 'year';
}

/** The one price the product uses: a staff seat, billed monthly. */
export const DEFAULT_PRICES: CatalogPrice[] = [
  {
    id: 'price_wmStaffSeatMonthly',
    productId: 'prod_wmStaffSeat',
    productName: 'Warpmeter staff seat',
    lookupKey: 'warpmeter_staff_seat_monthly',
    currency: 'eur',
    unitAmount: 1900,
    interval: 'month',
  },
];
