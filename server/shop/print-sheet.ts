/** How many pieces of each variant to print for a run: pure arithmetic on paid units and the printer's rules. */
import type { PrinterRules, PrintSheetLine } from '../../contracts/shop/staff-shop-answers';

/** Rounds `n` up to a multiple of `m` (m >= 1). */
export function roundUpTo(n: number, m: number): number {
  return Math.ceil(n / m) * m;
}

/**
 * Per variant: paid + spares (percent, rounded up), rounded up to the pack multiple. When the design's total is
 * below the printer's minimum, the shortfall goes to the best-selling variant, in whole packs.
 */
export function printQuantities(
  variants: { variantId: number; label: string; sku: string; paid: number }[],
  rules: PrinterRules,
): { lines: PrintSheetLine[]; totalPaid: number; totalToPrint: number } {
  const pack = Math.max(1, rules.packMultiple);
  const lines = variants.map((v) => {
    const spares = Math.ceil((v.paid * rules.sparesPercent) / 100);
    return { ...v, spares, toPrint: v.paid === 0 ? 0 : roundUpTo(v.paid + spares, pack) };
  });
  const total = () => lines.reduce((s, l) => s + l.toPrint, 0);
  const totalPaid = lines.reduce((s, l) => s + l.paid, 0);
  if (totalPaid > 0 && total() < rules.minimumPerDesign) {
    const top = lines.reduce((best, l) => (l.paid > best.paid ? l : best), lines[0]);
    top.toPrint += roundUpTo(rules.minimumPerDesign - total(), pack);
  }
  return { lines, totalPaid, totalToPrint: total() };
}
