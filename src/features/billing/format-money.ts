/** An amount in a currency's minor unit (cents), in the reader's locale: "€19.00", "−€7.60". */
export function formatMoney(minor: number, currency: string): string {
  return new Intl.NumberFormat(undefined, { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
}

/** "€19.00 per seat / month" */
export const formatSeatPrice = (unitAmount: number, currency: string, interval: string) =>
  `${formatMoney(unitAmount, currency)} per seat / ${interval}`;
