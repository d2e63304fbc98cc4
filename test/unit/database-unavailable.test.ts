import { isDatabaseUnavailable } from '../../server/platform/database-unavailable';

// Codes from the PostgreSQL 15 manual, appendix A "Error Codes"; messages as node-postgres and knex word them (from memory).
describe('V7.4.1 isDatabaseUnavailable tells a lost database from a bad request (OWASP ASVS 4.0.3 7.4.1)', () => {
  const withCode = (code: string, message = 'x') => Object.assign(new Error(message), { code });
  it.each([
    ['a refused connection', withCode('ECONNREFUSED', 'connect ECONNREFUSED 127.0.0.1:5432')],
    ['admin_shutdown', withCode('57P01', 'terminating connection due to administrator command')],
    ['crash_shutdown', withCode('57P02')],
    ['cannot_connect_now', withCode('57P03', 'the database system is starting up')],
    ['connection_failure', withCode('08006')],
    [
      'a dropped connection in knex words',
      new Error('select * from "users" where "id" = $1 limit $2 - Connection terminated unexpectedly'),
    ],
    [
      'a pool that cannot get a connection',
      new Error('Knex: Timeout acquiring a connection. The pool is probably full.'),
    ],
    ['a refusal wrapped in an AggregateError', new AggregateError([withCode('ECONNREFUSED')], '')],
  ])('says yes for %s', (_what, err) => expect(isDatabaseUnavailable(err)).toBe(true));
  it.each([
    ['a unique violation', withCode('23505')],
    ['a character the database refuses', withCode('22021')],
    ['a plain error', new Error('boom')],
    ['nothing', undefined],
  ])('says no for %s', (_what, err) => expect(isDatabaseUnavailable(err)).toBe(false));
});
