import { HttpClient, HttpEventType, HttpParams, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, filter, map } from 'rxjs';

import type {
  AttachmentDto, RevisionDto, SetupCheck, SetupDto, SetupExportDto, SetupOwnerDto, SetupPageDto, SetupSort, SetupStatus,
} from '../../../shared/api/setup';
import { quietErrors } from '../core/api-error';
import { SETUP_KIND_LABELS } from '../../../shared/api/setup';

/** Filters, sort and page of the library list. */
export interface LibraryQuery {
  readonly q?: string;
  readonly kind?: string;
  readonly status?: SetupStatus | '';
  readonly ownerId?: number | null;
  readonly job?: string;
  readonly sort?: SetupSort;
  readonly dir?: 'asc' | 'desc';
  /** 1-based page. */
  readonly page?: number;
  readonly pageSize?: number;
}

/** The editable fields of a set-up, sent with the version they were based on. */
export interface SetupEdit {
  readonly name: string;
  readonly kind: string;
  readonly inputs: Record<string, unknown>;
  readonly notes: string;
  readonly job: string | null;
  readonly checks: SetupCheck[];
  readonly version: number;
}

/** Progress of an upload: percent while sending, then the stored attachment. */
export type UploadProgress = { readonly done: false; readonly percent: number } | { readonly done: true; readonly attachment: AttachmentDto };

/** Checks the JSON of a library page, throwing when the shape is wrong. */
export function parseSetupPage(json: unknown): SetupPageDto {
  const body = json as Partial<SetupPageDto> | null;
  if (!body || !Array.isArray(body.setups) || typeof body.total !== 'number' || typeof body.page !== 'number' || typeof body.pageSize !== 'number') {
    throw new Error('LibraryApi: the server sent a set-up list without setups, total, page and pageSize.');
  }
  return body as SetupPageDto;
}

/** Checks the JSON of one set-up. */
export function parseSetup(json: unknown): SetupDto {
  const s = json as Partial<SetupDto> | null;
  if (!s || typeof s.id !== 'number' || typeof s.name !== 'string' || typeof s.version !== 'number' || typeof s.status !== 'string') {
    throw new Error('LibraryApi: the server sent a set-up without id, name, version and status.');
  }
  return { ...s, checks: Array.isArray(s.checks) ? s.checks : [] } as SetupDto;
}

/** The set-up library over HTTP: list, detail, edit, release, history, attachments, export and import. */
@Injectable({ providedIn: 'root' })
export class LibraryApi {
  private readonly http = inject(HttpClient);

  /** One page of the team's set-ups for the given filters. */
  list(query: LibraryQuery): Observable<SetupPageDto> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
    }
    return this.http.get<unknown>('/api/setups', { params }).pipe(map(parseSetupPage));
  }

  /** Everyone who owns set-ups the caller may see, with how many, by name. */
  owners(): Observable<SetupOwnerDto[]> {
    return this.http.get<{ owners?: unknown }>('/api/setups/owners').pipe(
      map((body) => {
        if (!body || !Array.isArray(body.owners)) throw new Error('LibraryApi: the server sent an owner list without owners.');
        return body.owners as SetupOwnerDto[];
      }),
    );
  }

  get(id: number): Observable<SetupDto> {
    return this.http.get<unknown>(`/api/setups/${id}`).pipe(map(parseSetup));
  }

  /** Saves an edit; a 409 (someone else changed it) comes back to the caller to show. */
  update(id: number, edit: SetupEdit): Observable<SetupDto> {
    return this.http.put<unknown>(`/api/setups/${id}`, edit, { context: quietErrors() }).pipe(map(parseSetup));
  }

  release(id: number, version: number): Observable<SetupDto> {
    return this.http.post<unknown>(`/api/setups/${id}/release`, { version }).pipe(map(parseSetup));
  }

  archive(id: number, version: number): Observable<SetupDto> {
    return this.http.post<unknown>(`/api/setups/${id}/archive`, { version }).pipe(map(parseSetup));
  }

  /** Deletes a draft that was never released; a refusal (409) comes back to the caller to show. */
  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/setups/${id}`, { context: quietErrors() });
  }

  revisions(id: number): Observable<RevisionDto[]> {
    return this.http.get<{ revisions: RevisionDto[] }>(`/api/setups/${id}/revisions`).pipe(map((r) => r.revisions ?? []));
  }

  attachments(id: number): Observable<AttachmentDto[]> {
    return this.http.get<{ attachments: AttachmentDto[] }>(`/api/setups/${id}/attachments`).pipe(map((r) => r.attachments ?? []));
  }

  /** Uploads one file (multipart field "file"), reporting progress; errors come back to the caller. */
  upload(id: number, file: File): Observable<UploadProgress> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<AttachmentDto>(`/api/setups/${id}/attachments`, form, { reportProgress: true, observe: 'events', context: quietErrors() }).pipe(
      filter((e: HttpEvent<AttachmentDto>) => e.type === HttpEventType.UploadProgress || e.type === HttpEventType.Response),
      map((e): UploadProgress => {
        if (e.type === HttpEventType.UploadProgress) return { done: false, percent: e.total ? Math.round((100 * e.loaded) / e.total) : 0 };
        if (e.type === HttpEventType.Response && e.body) return { done: true, attachment: e.body };
        throw new Error('LibraryApi: the upload ended without an attachment.');
      }),
    );
  }

  removeAttachment(setupId: number, attachmentId: number): Observable<void> {
    return this.http.delete<void>(`/api/setups/${setupId}/attachments/${attachmentId}`, { context: quietErrors() });
  }

  /** Imports an exported set-up into the signed-in user's team as a draft. */
  import(exported: SetupExportDto | unknown): Observable<SetupDto> {
    return this.http.post<unknown>('/api/setups/import', exported, { context: quietErrors() }).pipe(map(parseSetup));
  }
}

/** Address of a set-up's PDF sheet. */
export const sheetUrl = (id: number) => `/api/setups/${id}/sheet.pdf`;
/** Address of a set-up's JSON export. */
export const exportUrl = (id: number) => `/api/setups/${id}/export`;
/** Address of an attachment's file. */
export const attachmentUrl = (setupId: number, attachmentId: number, inline = false) => `/api/setups/${setupId}/attachments/${attachmentId}${inline ? '?inline=1' : ''}`;
/** Address of an image attachment's thumbnail. */
export const thumbnailUrl = (setupId: number, attachmentId: number) => `/api/setups/${setupId}/attachments/${attachmentId}/thumbnail`;

/** Display names of the set-up kinds (the calculation areas) and the page each opens in. */
export const KIND_AREAS: Readonly<Partial<Record<string, { label: string; path: string }>>> = {
  taper: { label: SETUP_KIND_LABELS.taper, path: '/taper' },
  'sine-bar': { label: SETUP_KIND_LABELS['sine-bar'], path: '/sine-bar' },
  'gauge-blocks': { label: SETUP_KIND_LABELS['gauge-blocks'], path: '/gauge-blocks' },
  'angle-blocks': { label: SETUP_KIND_LABELS['angle-blocks'], path: '/angle-blocks' },
  'lathe-taper': { label: SETUP_KIND_LABELS['lathe-taper'], path: '/lathe-tapers' },
  'pins-rolls': { label: SETUP_KIND_LABELS['pins-rolls'], path: '/pins-rolls' },
};

/** Display names of the statuses. */
export const STATUS_LABELS: Readonly<Record<SetupStatus, string>> = { draft: 'Draft', released: 'Released', archived: 'Archived' };
