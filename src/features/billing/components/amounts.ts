/** How credit, money and system counts read on the billing pages. */

const whole = new Intl.NumberFormat('en-GB');

export function formatCredits(credits: number): string {
  return `${whole.format(credits)} credit${Math.abs(credits) === 1 ? '' : 's'}`;
}

/** Signed, for ledger changes: "+100", "−20", "0". */
export function formatChange(value: number): string {
  if (value === 0) return '0';
  return `${value > 0 ? '+' : '−'}${whole.format(Math.abs(value))}`;
}

/** Systems, or any whole count: "500,000,000". */
export function formatCount(n: number): string {
  return whole.format(n);
}

export function formatMoney(minor: number, currency: string): string {
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
}
