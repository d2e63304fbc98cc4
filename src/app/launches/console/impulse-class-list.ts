import type { AbstractControl, ValidationErrors } from '@angular/forms';

const LETTER = /^[A-Z]$/;

/**
 * The impulse classes typed for one certification level: letters and ranges, separated by commas or spaces
 * ("A-G", "H, I", "a b c"). Sorted, each once; null when the text cannot be read (a digit, "G-A", "AB").
 */
export function parseClassList(text: string): string[] | null {
  const parts = text
    .toUpperCase()
    .replace(/\s*[-–]\s*/g, '-')
    .split(/[\s,]+/)
    .filter(Boolean);
  const classes = new Set<string>();
  for (const part of parts) {
    const [from, to, ...rest] = part.split('-');
    if (rest.length > 0 || !LETTER.test(from) || (to !== undefined && !LETTER.test(to))) return null;
    const last = (to ?? from).charCodeAt(0);
    if (last < from.charCodeAt(0)) return null;
    for (let c = from.charCodeAt(0); c <= last; c++) classes.add(String.fromCharCode(c));
  }
  return [...classes].sort();
}

/** The classes written back as the shortest text that reads the same: runs as "A-G", the rest as single letters. */
export function formatClassList(classes: readonly string[]): string {
  const codes = [...new Set(classes.map((c) => c.toUpperCase().charCodeAt(0)))].sort((a, b) => a - b);
  const runs: string[] = [];
  for (let i = 0; i < codes.length;) {
    let j = i;
    while (j + 1 < codes.length && codes[j + 1] === codes[j] + 1) j++;
    const from = String.fromCharCode(codes[i]);
    runs.push(
      j === i
        ? from
        : j === i + 1
          ? `${from}, ${String.fromCharCode(codes[j])}`
          : `${from}-${String.fromCharCode(codes[j])}`,
    );
    i = j + 1;
  }
  return runs.join(', ');
}

/** The form check for a class list; its value is the message to show beside the field. */
export function classListValidator(control: AbstractControl<string>): ValidationErrors | null {
  return parseClassList(control.value ?? '') === null
    ? { classes: 'Use letters and ranges such as "A-G" or "H, I".' }
    : null;
}
