/**
 * Layers point down: the platform knows no feature, routers no repositories (nor Knex), repositories no services,
 * the app no server, and contracts (read by both sides) nothing but zod and each other; a repository method that
 * writes takes the caller's transaction first. Each check lists the offending file and import (or line).
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const root = path.join(__dirname, '..', '..');

interface Import {
  /** The importing file, from the repository root (`server/shop/order-repository.ts`). */
  file: string;
  /** The specifier as written. */
  specifier: string;
  /** Where a relative specifier points, from the repository root without extension; null for a package. */
  target: string | null;
}

const SPECIFIER = /(?:\bfrom\s*|\bimport\s*\(\s*|^\s*import\s+)['"]([^'"]+)['"]/gm;

function tsFiles(dir: string): string[] {
  return (readdirSync(path.join(root, dir), { recursive: true }) as string[])
    .filter((f) => f.endsWith('.ts'))
    .map((f) => path.posix.join(dir, f.split(path.sep).join('/')));
}

function importsOf(dir: string): Import[] {
  return tsFiles(dir).flatMap((file) =>
    [...readFileSync(path.join(root, file), 'utf8').matchAll(SPECIFIER)].map(([, specifier]) => ({
      file,
      specifier,
      target: specifier.startsWith('.')
        ? path.posix.normalize(path.posix.join(path.posix.dirname(file), specifier))
        : null,
    })),
  );
}

const listed = (bad: Import[]) => bad.map((i) => `${i.file} imports '${i.specifier}'`);

describe('server layers', () => {
  const server = importsOf('server');

  it('finds the imports it checks', () => {
    expect(server.length).toBeGreaterThan(500);
  });

  it('keeps server/platform to itself, the contracts, the config and packages', () => {
    const allowed = (t: string) =>
      t.startsWith('server/platform/') || t.startsWith('contracts/') || t === 'server/config';
    const bad = server.filter((i) => i.file.startsWith('server/platform/') && i.target !== null && !allowed(i.target));
    expect(listed(bad)).toEqual([]);
  });

  it('builds the processor client in one place, and the gateway keeps it to itself', () => {
    const bad = server.filter((i) => i.target === 'server/payments/stripe-client' && i.file !== 'server/deps.ts');
    expect(listed(bad)).toEqual([]);
    const gateway = readFileSync(path.join(root, 'server/payments/payment-gateway.ts'), 'utf8');
    expect(gateway).toMatch(/constructor\(\s*private readonly stripe: Stripe\b/);
  });

  it('lets no router import a repository or Knex: routes call services only', () => {
    const bad = server.filter(
      (i) =>
        i.file.endsWith('-routes.ts') &&
        (i.target !== null
          ? i.target.endsWith('-repository')
          : i.specifier === 'knex' || i.specifier.startsWith('knex/')),
    );
    expect(listed(bad)).toEqual([]);
  });

  it('keeps SQL in repositories: no service names a table or runs raw SQL', () => {
    const sql = /\b(?:trx|db)(?:<[^>]*>)?\(\s*['"`]|\.(?:raw|whereRaw|fromRaw|joinRaw)\(/;
    const bad = tsFiles('server')
      .filter((f) => f.endsWith('-service.ts'))
      .flatMap((file) =>
        readFileSync(path.join(root, file), 'utf8')
          .split('\n')
          .flatMap((line, i) => (sql.test(line) ? [`${file}:${i + 1}: ${line.trim()}`] : [])),
      );
    expect(bad).toEqual([]);
  });

  it('lets no repository import a service', () => {
    const bad = server.filter(
      (i) => i.file.endsWith('-repository.ts') && i.target !== null && i.target.endsWith('-service'),
    );
    expect(listed(bad)).toEqual([]);
  });
});

describe('client and contracts', () => {
  it('lets nothing in src/ import from server/', () => {
    const bad = importsOf('src').filter((i) => i.target?.startsWith('server/') || i.specifier.startsWith('server/'));
    expect(listed(bad)).toEqual([]);
  });

  it('keeps contracts/ free of the server, the app, Angular and Express', () => {
    const forbidden = (i: Import) =>
      i.target !== null
        ? !i.target.startsWith('contracts/')
        : i.specifier.startsWith('@angular/') || i.specifier === 'express' || i.specifier.startsWith('express/');
    expect(listed(importsOf('contracts').filter(forbidden))).toEqual([]);
  });
});

describe('sponsors and build logs keep to their own tables', () => {
  /**
   * Who owns which table. A post's thanks (`post_credits`, written with the post from its credit markers) are the
   * build logs'; the credits given (`sponsor_credits`, whose `post_id` only names the crediting post) are the sponsors'.
   * Across the two, the services compose through what each feature lends the other (`SponsorCredits`, `PostTitles`).
   */
  const OWNED: Record<string, readonly string[]> = {
    'server/sponsors': [
      'sponsors',
      'sponsor_contacts',
      'sponsor_agreements',
      'agreement_in_kind',
      'agreement_deliverables',
      'sponsor_credits',
    ],
    'server/build-logs': ['posts', 'post_credits'],
  };

  /** Each line of the file's code, comments blanked (line numbers kept), so only what runs is checked. */
  const codeLines = (file: string) =>
    readFileSync(path.join(root, file), 'utf8')
      .replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, ' '))
      .replace(/\/\/.*$/gm, '')
      .split('\n');

  it.each(Object.keys(OWNED))('lets no repository in %s name another feature’s table', (dir) => {
    const foreign = Object.entries(OWNED).flatMap(([other, tables]) => (other === dir ? [] : tables));
    const names = new RegExp(`\\b(?:${foreign.join('|')})\\b`);
    const repositories = tsFiles(dir).filter((f) => f.endsWith('-repository.ts'));
    expect(repositories.length).toBeGreaterThan(0);
    const bad = repositories.flatMap((file) =>
      codeLines(file).flatMap((line, i) => (names.test(line) ? [`${file}:${i + 1}: ${line.trim()}`] : [])),
    );
    expect(bad).toEqual([]);
  });
});

describe('repository transactions', () => {
  // Statements that write or lock rows; a raw SQL string that writes counts too.
  const WRITES = new Set([
    'insert',
    'update',
    'del',
    'delete',
    'increment',
    'decrement',
    'upsert',
    'merge',
    'truncate',
    'forUpdate',
    'forShare',
    'forNoKeyUpdate',
    'forKeyShare',
  ]);
  const WRITING_SQL = /\b(?:INSERT\s+INTO|UPDATE\s+\w+\s+SET|DELETE\s+FROM)\b/i;
  const EITHER = /\bKnex\s*\|\s*Knex\.Transaction\b|\bKnex\.Transaction\s*\|\s*Knex\b/;
  const repositories = tsFiles('server').filter((f) => f.endsWith('-repository.ts'));

  /** Whether a chain such as `this.db('t').where(...).update(...)` starts at `this.db`. */
  function startsAtThisDb(node: ts.Expression): boolean {
    let n = node;
    while (n.getText() !== 'this.db') {
      if (ts.isCallExpression(n) || ts.isPropertyAccessExpression(n) || ts.isNonNullExpression(n)) n = n.expression;
      else if (ts.isParenthesizedExpression(n) || ts.isAwaitExpression(n)) n = n.expression;
      else return false;
    }
    return true;
  }

  /** Each method of each repository class that writes, with the writes it makes through `this.db`. */
  function writingMethods(file: string) {
    const text = readFileSync(path.join(root, file), 'utf8');
    const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true);
    const found: { name: string; line: number; firstParam: string; viaThisDb: boolean }[] = [];
    const visitMethod = (m: ts.MethodDeclaration) => {
      let writes = false;
      let viaThisDb = false;
      const walk = (n: ts.Node) => {
        const sql =
          (ts.isStringLiteral(n) || ts.isNoSubstitutionTemplateLiteral(n) || ts.isTemplateExpression(n)) &&
          WRITING_SQL.test(n.getText());
        const call =
          ts.isCallExpression(n) && ts.isPropertyAccessExpression(n.expression) && WRITES.has(n.expression.name.text);
        if (sql || call) {
          writes = true;
          const statement = call ? n : ts.findAncestor(n, ts.isCallExpression);
          if (statement && startsAtThisDb(statement)) viaThisDb = true;
        }
        ts.forEachChild(n, walk);
      };
      if (m.body) walk(m.body);
      if (!writes) return;
      const p = m.parameters[0];
      const firstParam =
        p && !p.questionToken && !p.initializer && p.type ? `${p.name.getText()}: ${p.type.getText()}` : '';
      found.push({
        name: m.name.getText(),
        line: source.getLineAndCharacterOfPosition(m.getStart()).line + 1,
        firstParam,
        viaThisDb,
      });
    };
    const visit = (n: ts.Node) => {
      if (ts.isMethodDeclaration(n)) visitMethod(n);
      ts.forEachChild(n, visit);
    };
    visit(source);
    return found;
  }

  it('finds the repositories and the writes it checks', () => {
    expect(repositories.length).toBeGreaterThan(15);
    expect(repositories.flatMap(writingMethods).length).toBeGreaterThan(40);
  });

  it('lets no repository take a connection-or-transaction: a write takes the transaction, a read may take one', () => {
    const bad = repositories.flatMap((file) =>
      readFileSync(path.join(root, file), 'utf8')
        .split('\n')
        .flatMap((line, i) =>
          EITHER.test(line) && !/^\s*(?:\/\/|\*)/.test(line) ? [`${file}:${i + 1}: ${line.trim()}`] : [],
        ),
    );
    expect(bad).toEqual([]);
  });

  it('makes every repository method that writes or locks take a required Knex.Transaction first, and write through it', () => {
    const bad = repositories.flatMap((file) =>
      writingMethods(file).flatMap((m) => [
        ...(/^\w+: Knex\.Transaction$/.test(m.firstParam)
          ? []
          : [
              `${file}:${m.line}: ${m.name} writes or locks, but its first parameter is '${m.firstParam || 'not a required, typed one'}'`,
            ]),
        ...(m.viaThisDb ? [`${file}:${m.line}: ${m.name} writes through this.db`] : []),
      ]),
    );
    expect(bad).toEqual([]);
  });
});
