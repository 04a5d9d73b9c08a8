import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, map } from 'rxjs';

import type { SetupCreateBody, SetupDto, SetupKind } from '../../../shared/api/setup';
import { quietErrors } from '../core/api-error';

/** The parts of a saved set-up a workbench page needs. */
export interface SavedSetup {
  /** Set-up id. */
  readonly id: number;
  /** Its name. */
  readonly name: string;
  /** The area it belongs to. */
  readonly kind: string;
  /** The page's form values when it was saved. */
  readonly inputs: Readonly<Record<string, unknown>>;
  /** Job number, if any. */
  readonly job: string | null;
}

/** Checks the JSON of a set-up, throwing when a needed field is missing or of the wrong type. */
export function parseSavedSetup(json: unknown): SavedSetup {
  if (typeof json !== 'object' || json === null) throw new Error('SetupsApi: the server sent no set-up.');
  const { id, name, kind, inputs, job } = json as Partial<Record<keyof SetupDto, unknown>>;
  if (typeof id !== 'number' || typeof name !== 'string' || typeof kind !== 'string' || typeof inputs !== 'object' || inputs === null) {
    throw new Error('SetupsApi: the server sent a set-up without a valid id, name, kind and inputs.');
  }
  return { id, name, kind, inputs: inputs as Record<string, unknown>, job: typeof job === 'string' ? job : null };
}

/** Saving and opening set-ups from the workbench pages (POST /api/setups, GET /api/setups/:id). */
@Injectable({ providedIn: 'root' })
export class SetupsApi {
  private readonly http = inject(HttpClient);

  /** Saves a new set-up; errors come back to the caller (the dialog shows them inline). */
  create(body: SetupCreateBody): Observable<SavedSetup> {
    return this.http.post<unknown>('/api/setups', body, { context: quietErrors() }).pipe(map(parseSavedSetup));
  }

  /** Loads one set-up of the team; errors come back to the caller. */
  get(id: number): Observable<SavedSetup> {
    return this.http.get<unknown>(`/api/setups/${id}`, { context: quietErrors() }).pipe(map(parseSavedSetup));
  }
}

/** Whether a set-up belongs to a page's area. */
export function isSetupOf(setup: SavedSetup, kind: SetupKind): boolean {
  return setup.kind === kind;
}
