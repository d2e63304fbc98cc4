/**
 * The label a person reads for a code. The maps are exhaustive for the codes the database allows; a code that is
 * not in the map (a newer server than this page, say) still reads as words, never as `snake_case`.
 */
export function labelOf<K extends string>(
  labels: Readonly<Record<K, string>>,
  code: K | string | null | undefined,
): string {
  if (code === null || code === undefined || code === '') return '';
  const known = (labels as Readonly<Record<string, string>>)[code];
  return known ?? codeInWords(code);
}

/** A code someone else chose (a card processor's reason, say) as words: "product_not_received" -> "Product not received". */
export function codeInWords(code: string): string {
  const words = code.replace(/[_-]+/g, ' ').trim().toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** "Yes" or "No", as tables and CSV cells say it. */
export function yesNo(value: boolean): string {
  return value ? 'Yes' : 'No';
}
