const dateFormat = new Intl.DateTimeFormat(undefined, { year: 'numeric', month: 'short', day: 'numeric' });

/** A calendar date in the reader's locale ("2 Dec 2025"); an unreadable value is shown as is. */
export function formatDate(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateFormat.format(d);
}

/** "1 staff seat", "3 staff seats". */
export const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
