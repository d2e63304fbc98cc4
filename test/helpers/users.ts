import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { hashPassword } from '../../server/auth/password-hash';
import type { Role } from '../../server/platform/roles';

export const TEST_PASSWORD = 'correct horse battery staple';

export interface TestUser {
  id: number;
  email: string;
  password: string;
  roles: Role[];
}

let cachedHash: Promise<string> | undefined;

/** Inserts a user with a unique e-mail; every test makes its own. */
export async function createUser(db: Knex, roles: Role[] = ['fan'], name = 'Test User'): Promise<TestUser> {
  cachedHash ??= hashPassword(TEST_PASSWORD);
  const email = `${roles.join('-')}-${randomUUID().slice(0, 8)}@example.test`;
  const [row] = await db('users')
    .insert({ email, password_hash: await cachedHash, display_name: name, roles, email_verified_at: db.fn.now() })
    .returning('id');
  return { id: Number(row.id), email, password: TEST_PASSWORD, roles };
}

/** A cookie-keeping client that sends the session's CSRF token on every state-changing call. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  private csrf = '';

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  async token(): Promise<string> {
    this.csrf ||= (await this.agent.get('/api/auth/csrf')).body.csrfToken;
    return this.csrf;
  }

  get(url: string) {
    return this.agent.get(url);
  }
  async post(url: string, body?: object) {
    // The token first: the agent attaches its cookies when the request is created.
    const token = await this.token();
    const res = await this.agent.post(url).set('X-CSRF-Token', token).send(body);
    // Sign-in, registration and sign-out start a new session with a new token.
    if (/^\/api\/auth\/(login|register|logout)$/.test(url)) this.csrf = '';
    return res;
  }
  async put(url: string, body?: object) {
    // The token first: the agent attaches its cookies when the request is created.
    const token = await this.token();
    return this.agent.put(url).set('X-CSRF-Token', token).send(body);
  }
  async patch(url: string, body?: object) {
    // The token first: the agent attaches its cookies when the request is created.
    const token = await this.token();
    return this.agent.patch(url).set('X-CSRF-Token', token).send(body);
  }
  async delete(url: string) {
    const token = await this.token();
    return this.agent.delete(url).set('X-CSRF-Token', token);
  }

  /** Signs in; the session id changes, so the CSRF token is fetched again afterwards. */
  async signIn(user: { email: string; password: string }) {
    const res = await this.post('/api/auth/login', { email: user.email, password: user.password });
    if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res;
  }
}

/** A new client signed in as a fresh user with the roles. */
export async function signedIn(
  app: Express,
  db: Knex,
  roles: Role[] = ['fan'],
): Promise<{ client: Client; user: TestUser }> {
  const user = await createUser(db, roles);
  const client = new Client(app);
  await client.signIn(user);
  return { client, user };
}
