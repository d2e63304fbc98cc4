import type { z } from 'zod';
import { markdownProblem } from './render-markdown';

/**
 * A zod refinement for Markdown fields: the text is rendered before it is stored, and text the pipeline cannot
 * render (nested too deep, too long) is refused as a field error instead of breaking every page that shows it.
 */
export function refuseUnrenderable(value: string, ctx: z.RefinementCtx): void {
  const problem = markdownProblem(value);
  if (problem) ctx.addIssue({ code: 'custom', message: problem });
}
