import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import type { PublicUser, Role } from '../../../shared/api/auth';
import { quietErrors } from './api-error';
import { CsrfToken } from './csrf';

/** The signed-in person as the API reports it. */
export type AuthUser = Readonly<PublicUser>;
export type { Role };

/** Display names of the roles (exhaustive over Role, so it also serves as the runtime list). */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  admin: 'Admin',
  lead: 'Lead hand',
  machinist: 'Machinist',
  apprentice: 'Apprentice',
};

/** Who is signed in: loads the session's user, signs in and out, and exposes the user as signals. */
@Injectable({ providedIn: 'root' })
export class Auth {
  private readonly http = inject(HttpClient);
  private readonly csrf = inject(CsrfToken);
  private readonly _user = signal<AuthUser | null>(null);
  private readonly _loaded = signal(false);
  private loading: Promise<AuthUser | null> | null = null;

  /** The signed-in user, or null when anonymous (or not yet known). */
  readonly user = this._user.asReadonly();
  /** Whether the session's user has been asked for at least once. */
  readonly loaded = this._loaded.asReadonly();
  /** Whether someone is signed in. */
  readonly signedIn = computed(() => this._user() !== null);

  /**
   * Asks the server who is signed in (GET /api/auth/session, which answers 200 with `user: null`
   * for nobody, so an anonymous visit logs no failed request); any failure means nobody.
   */
  load(): Promise<AuthUser | null> {
    const request = firstValueFrom(this.http.get<{ user?: unknown }>('/api/auth/session', { context: quietErrors() }))
      .then(body => (body?.user === null ? null : parseAuthUser(body?.user)))
      .catch((err: unknown) => {
        console.warn('Auth: could not load the signed-in user.', err);
        return null;
      })
      .then(user => {
        this._user.set(user);
        this._loaded.set(true);
        return user;
      });
    this.loading = request;
    return request;
  }

  /** The user once known: reuses the first load instead of asking the server again. */
  ready(): Promise<AuthUser | null> {
    return this.loading ?? this.load();
  }

  /**
   * Signs in with e-mail and password (POST /api/auth/login). Resolves with the user; rejects with
   * the HttpErrorResponse (401 wrong credentials, 429 throttled) for the form to show.
   */
  async signIn(email: string, password: string): Promise<AuthUser> {
    const body = await firstValueFrom(
      this.http.post<unknown>('/api/auth/login', { email, password }, { context: quietErrors() }),
    );
    const user = parseAuthUser(typeof body === 'object' && body !== null ? (body as { user?: unknown }).user : null);
    // The session is regenerated on sign-in, so the old token no longer matches it.
    this.csrf.reset();
    this.setUser(user);
    return user;
  }

  /** Signs out (POST /api/auth/logout) and forgets the user, even if the server call fails. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post('/api/auth/logout', null));
    } finally {
      this.csrf.reset();
      this.setUser(null);
    }
  }

  /** Forgets the user without a server call: the server said the session is gone (a 401). */
  markSignedOut(): void {
    if (this._user() !== null) this.csrf.reset();
    this.setUser(null);
  }

  private setUser(user: AuthUser | null): void {
    this._user.set(user);
    this._loaded.set(true);
    this.loading = Promise.resolve(user);
  }
}

/** Checks the JSON of a user, throwing when any field is missing or of the wrong type. */
export function parseAuthUser(json: unknown): AuthUser {
  if (typeof json !== 'object' || json === null) throw new Error('Auth: the server sent no user.');
  const { id, email, name, role } = json as Record<string, unknown>;
  if (typeof id !== 'number' || typeof email !== 'string' || typeof name !== 'string' || !isRole(role)) {
    throw new Error('Auth: the server sent a user without a valid id, email, name and role.');
  }
  return { id, email, name, role };
}

/** Whether a value is one of the four roles. */
export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && Object.hasOwn(ROLE_LABELS, value);
}
