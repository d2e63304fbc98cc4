const CAD = new Intl.NumberFormat('en-CA', { style: 'currency', currency: 'CAD' });

/** Cents as people read them in e-mails, reports and messages: 1250 -> "$12.50". */
export function formatCad(cents: number): string {
  return CAD.format(cents / 100);
}
