/** The current calendar quarter as YYYY-MM-DD dates, a common filing period for small GST/HST registrants. */
export function currentQuarter(today = new Date()): { from: string; to: string } {
  const y = today.getFullYear();
  const q = Math.floor(today.getMonth() / 3);
  const pad = (n: number) => String(n).padStart(2, '0');
  const lastDay = new Date(y, q * 3 + 3, 0).getDate();
  return { from: `${y}-${pad(q * 3 + 1)}-01`, to: `${y}-${pad(q * 3 + 3)}-${pad(lastDay)}` };
}
