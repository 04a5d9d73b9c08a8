/**
 * Helpers for API tests against the real MariaDB that scripts/run-tests.ts starts. Each test file
 * makes its own team and members, so files can run in parallel without touching each other's data.
 */
import { randomBytes } from 'node:crypto';
import bcrypt from 'bcrypt';
import type { Express } from 'express';
import request from 'supertest';
import type { Role } from '../../shared/api/auth';
import { createApp } from '../../server/app';
import { loadConfig, type AppConfig } from '../../server/config';
import { createSequelize } from '../../server/db';
import { initModels, Team, User } from '../../server/models';
import { BCRYPT_COST } from '../../server/routes/auth';

export const PASSWORD = 'correct-horse-battery';

export interface TestApp {
  readonly app: Express;
  readonly config: AppConfig;
  close(): Promise<void>;
}

/** The app on the test database, trusting X-Forwarded-For so each file can act from its own address. */
export function openApp(overrides: Partial<AppConfig> = {}): TestApp {
  const config: AppConfig = { ...loadConfig(), staticDir: null, trustProxy: true, ...overrides };
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  const { app, close } = createApp({ config, sequelize });
  return {
    app,
    config,
    async close() {
      close();
      await sequelize.close();
    },
  };
}

export type Members = Record<Role, User> & { team: Team; other: User };

let hash: Promise<string> | null = null;

/** A fresh team with one member of each role plus a second machinist (`other`). */
export async function makeTeam(label: string): Promise<Members> {
  hash ??= bcrypt.hash(PASSWORD, BCRYPT_COST);
  const passwordHash = await hash;
  const tag = `${label}-${randomBytes(4).toString('hex')}`;
  const team = await Team.create({ name: `Test shop ${tag}` });
  const make = (role: Role, who: string) => User.create({ teamId: team.id, email: `${who}.${tag}@example.test`, name: `${who} ${tag}`, role, passwordHash });
  return {
    team,
    admin: await make('admin', 'admin'),
    lead: await make('lead', 'lead'),
    machinist: await make('machinist', 'machinist'),
    apprentice: await make('apprentice', 'apprentice'),
    other: await make('machinist', 'other'),
  };
}

/** A client address of its own, so sign-in throttling in one file never affects another. */
export function clientIp(): string {
  const b = randomBytes(3);
  return `10.${b[0]}.${b[1]}.${b[2]}`;
}

export interface Client {
  readonly agent: ReturnType<typeof request.agent>;
  readonly token: string;
  readonly ip: string;
}

/** A cookie-keeping client with a CSRF token, signed in as `user` when given. */
export async function client(app: Express, user?: User, ip = clientIp()): Promise<Client> {
  const agent = request.agent(app);
  agent.set('X-Forwarded-For', ip);
  const res = await agent.get('/api/auth/csrf').expect(200);
  const token = (res.body as { token: string }).token;
  if (user) {
    await agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email: user.email, password: PASSWORD }).expect(200);
  }
  return { agent, token, ip };
}
