import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';

const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

/**
 * axe-core's serious and critical findings for the page as it is now (WCAG 2.x A and AA rules), leaving out the
 * elements `exclude` selects. Running animations finish first: a field error fading in is measured at full colour,
 * not at whatever opacity the frame caught.
 */
export async function seriousViolations(page: Page, exclude: string[] = []): Promise<string[]> {
  await page.evaluate(() => Promise.all(document.getAnimations().map((a) => a.finished.catch(() => undefined))));
  await page.evaluate(axeSource);
  const violations = await page.evaluate(async (exclude) => {
    const axe = (
      window as unknown as { axe: { run(ctx: object, opts: object): Promise<{ violations: AxeViolation[] }> } }
    ).axe;
    return (
      await axe.run(
        { include: [document], exclude: exclude.map((s) => [s]) },
        { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } },
      )
    ).violations;
  }, exclude);
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.id}: ${v.help} (${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 3)
          .join('; ')})`,
    );
}
