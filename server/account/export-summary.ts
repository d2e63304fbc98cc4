import type { PersonalDataSection } from '../platform/personal-data';

/** What the summary page says about the download as a whole. */
export interface ExportMeta {
  siteName: string;
  email: string;
  generatedAt: Date;
  timeZone: string;
}

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A value as a person reads it in a table cell: nested lists and objects as compact JSON. */
function cell(value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'object') return escape(JSON.stringify(value));
  return escape(String(value));
}

function recordTable(record: unknown): string {
  if (record === null || typeof record !== 'object') return `<p>${cell(record)}</p>`;
  const rows = Object.entries(record as Record<string, unknown>).map(
    ([k, v]) => `<tr><th scope="row">${escape(k)}</th><td>${cell(v)}</td></tr>`,
  );
  return `<table>${rows.join('')}</table>`;
}

/**
 * The readable page inside the download (`summary.html`): what each file holds and why, then every record as a
 * table. Self-contained (no scripts, no outside styles) so it opens from the unpacked folder in any browser.
 */
export function exportSummaryHtml(sections: PersonalDataSection[], meta: ExportMeta): string {
  const when =
    new Intl.DateTimeFormat('en-CA', { dateStyle: 'long', timeStyle: 'short', timeZone: meta.timeZone }).format(
      meta.generatedAt,
    ) + ` (${meta.timeZone} time)`;
  const contents = sections.map(
    (s) =>
      `<li><a href="#${escape(s.name)}">${escape(s.title)}</a> — ${s.records.length} ${s.records.length === 1 ? 'entry' : 'entries'}, in <code>${escape(s.name)}.json</code></li>`,
  );
  const bodies = sections.map((s) =>
    [
      `<section id="${escape(s.name)}">`,
      `<h2>${escape(s.title)}</h2>`,
      `<p>${escape(s.purpose)}</p>`,
      `<p class="file">File: <code>${escape(s.name)}.json</code></p>`,
      s.records.length ? s.records.map(recordTable).join('') : '<p>Nothing held.</p>',
      '</section>',
    ].join('\n'),
  );
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(meta.siteName)}: what we hold about you</title>
<style>
body { font: 16px/1.5 system-ui, sans-serif; margin: 1rem auto; max-width: 60rem; padding: 0 1rem; color: #1b1b1f; }
table { border-collapse: collapse; margin: 0.5rem 0 1rem; width: 100%; }
th, td { border: 1px solid #c4c6d0; padding: 0.25rem 0.5rem; text-align: left; vertical-align: top; overflow-wrap: anywhere; }
th { width: 30%; font-weight: 600; background: #f2f0f4; }
code { font-size: 0.95em; }
</style>
</head>
<body>
<h1>What ${escape(meta.siteName)} holds about you</h1>
<p>For the account <strong>${escape(meta.email)}</strong>, made on ${escape(when)}.</p>
<p>Each part below is also a JSON file in this folder, for reading by a program. Amounts are in cents (Canadian dollars);
times are UTC unless the name says otherwise. If something is wrong, ask for a correction from your account page or the
privacy page.</p>
<h2>Contents</h2>
<ul>
${contents.join('\n')}
</ul>
${bodies.join('\n')}
</body>
</html>
`;
}
