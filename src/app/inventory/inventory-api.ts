import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { InventoryBlockPatch, InventoryCreateBody, InventoryListDto, InventorySetDto, InventoryType, InventoryUpdateBody } from '../../../shared/api/inventory';
import { quietErrors } from '../core/api-error';

/** A standard composition a set can start from. */
export interface StandardSetDto {
  id: string;
  name: string;
  type: InventoryType;
  total: number;
  source: string;
  status: string;
}

/** A stack or combination from the blocks in the box. */
export interface InventoryAnswer {
  blocks: Array<string | { angle: string; direction: string }>;
  count: number;
  total?: string;
  achievedAngleDms?: string;
  exact?: boolean;
  excluded: Array<{ size: string; label?: string; missing: number; damaged: number }>;
}

const PATHS: Record<InventoryType, string> = { 'gauge-blocks': 'gauge-sets', 'angle-blocks': 'angle-sets' };

/** The team's block sets over HTTP. */
@Injectable({ providedIn: 'root' })
export class InventoryApi {
  private readonly http = inject(HttpClient);

  list(): Observable<InventoryListDto> {
    return this.http.get<InventoryListDto>('/api/inventories');
  }

  standardSets(): Observable<{ sets: StandardSetDto[] }> {
    return this.http.get<{ sets: StandardSetDto[] }>('/api/inventories/standard-sets');
  }

  /** One set with its blocks; `quiet`: a failure is the caller's to show (no notice). */
  get(type: InventoryType, id: number, quiet = false): Observable<InventorySetDto> {
    return this.http.get<InventorySetDto>(`/api/inventories/${PATHS[type]}/${id}`, quiet ? { context: quietErrors() } : {});
  }

  create(type: InventoryType, body: InventoryCreateBody): Observable<InventorySetDto> {
    return this.http.post<InventorySetDto>(`/api/inventories/${PATHS[type]}`, body, { context: quietErrors() });
  }

  patchBlock(type: InventoryType, setId: number, blockId: number, patch: InventoryBlockPatch): Observable<InventorySetDto> {
    return this.http.patch<InventorySetDto>(`/api/inventories/${PATHS[type]}/${setId}/blocks/${blockId}`, patch, { context: quietErrors() });
  }

  /** The set's own details (name, grade, wear blocks, notes), against the version they were read at. */
  update(type: InventoryType, setId: number, body: InventoryUpdateBody): Observable<InventorySetDto> {
    return this.http.put<InventorySetDto>(`/api/inventories/${PATHS[type]}/${setId}`, body, { context: quietErrors() });
  }

  /** Deletes a set (admins only). */
  remove(type: InventoryType, setId: number): Observable<void> {
    return this.http.delete<void>(`/api/inventories/${PATHS[type]}/${setId}`, { context: quietErrors() });
  }

  /** A stack (between the wear blocks when `wear`) or a combination from what is in the box. */
  answer(type: InventoryType, setId: number, wanted: string, wear = false): Observable<InventoryAnswer> {
    const params = type === 'gauge-blocks' ? new HttpParams().set('target', wanted).set('wear', wear ? 'yes' : 'no') : new HttpParams().set('angle', wanted);
    const path = type === 'gauge-blocks' ? 'stack' : 'combination';
    return this.http.get<InventoryAnswer>(`/api/inventories/${PATHS[type]}/${setId}/${path}`, { params, context: quietErrors() });
  }
}
