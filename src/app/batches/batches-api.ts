import { HttpClient, HttpErrorResponse, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, map } from 'rxjs';

import type { BatchCorrectionBody, BatchCreateBody, BatchPartBody, BatchPartDto, BatchRunDto, BatchStatus } from '../../../shared/api/batch';
import { quietErrors } from '../core/api-error';

/** Checks the JSON of a batch run. */
export function parseRun(json: unknown): BatchRunDto {
  const r = json as Partial<BatchRunDto> | null;
  if (!r || typeof r.id !== 'number' || typeof r.setupId !== 'number' || !Array.isArray(r.checks) || typeof r.status !== 'string') {
    throw new Error('BatchesApi: the server sent a batch run without id, setupId, checks and status.');
  }
  return r as BatchRunDto;
}

/**
 * The run as it is now from a 409 answer to saving a part (closed, or the part recorded or corrected
 * meanwhile), or null for any other failure.
 */
export function conflictRun(err: unknown): BatchRunDto | null {
  if (!(err instanceof HttpErrorResponse) || err.status !== 409) return null;
  const body = err.error as { run?: unknown } | null;
  try {
    return body && typeof body === 'object' && body.run ? parseRun(body.run) : null;
  } catch {
    return null;
  }
}

/** Batch runs over HTTP. */
@Injectable({ providedIn: 'root' })
export class BatchesApi {
  private readonly http = inject(HttpClient);

  list(filter: { setupId?: number; status?: BatchStatus } = {}): Observable<BatchRunDto[]> {
    let params = new HttpParams();
    if (filter.setupId) params = params.set('setupId', filter.setupId);
    if (filter.status) params = params.set('status', filter.status);
    return this.http.get<{ batches: unknown[] }>('/api/batches', { params }).pipe(map((r) => (r.batches ?? []).map(parseRun)));
  }

  get(id: number): Observable<BatchRunDto> {
    return this.http.get<unknown>(`/api/batches/${id}`).pipe(map(parseRun));
  }

  start(body: BatchCreateBody): Observable<BatchRunDto> {
    return this.http.post<unknown>('/api/batches', body, { context: quietErrors() }).pipe(map(parseRun));
  }

  /** Records the next part; field errors come back to the caller to show beside the inputs. */
  addPart(runId: number, body: BatchPartBody): Observable<{ part: BatchPartDto; run: BatchRunDto }> {
    return this.http.post<{ part: BatchPartDto; run: unknown }>(`/api/batches/${runId}/parts`, body, { context: quietErrors() }).pipe(map((r) => ({ part: r.part, run: parseRun(r.run) })));
  }

  /**
   * Replaces the readings of a part already recorded (a mistyped reading), based on the part's
   * `revision` as loaded; field errors and a 409 (changed meanwhile) come back as for addPart.
   */
  correctPart(runId: number, partNo: number, body: BatchCorrectionBody): Observable<{ part: BatchPartDto; run: BatchRunDto }> {
    return this.http
      .put<{ part: BatchPartDto; run: unknown }>(`/api/batches/${runId}/parts/${partNo}`, body, { context: quietErrors() })
      .pipe(map((r) => ({ part: r.part, run: parseRun(r.run) })));
  }

  close(runId: number): Observable<BatchRunDto> {
    return this.http.post<unknown>(`/api/batches/${runId}/close`, {}).pipe(map(parseRun));
  }
}

/** Address of a run's CSV export. */
export const csvUrl = (id: number) => `/api/batches/${id}/export.csv`;
