import type { Params } from '@angular/router';
import type { Sort } from '@angular/material/sort';

import { SETUP_KINDS, SETUP_SORTS, SETUP_STATUSES, type SetupStatus } from '../../../shared/api/setup';

/** Page sizes the library's paginator offers. */
export const PAGE_SIZES = [10, 25, 50] as const;

/** What the library shows: the filters, the sort and the page, as the page's controls hold them. */
export interface LibraryView {
  search: string;
  kind: string;
  status: SetupStatus | '';
  job: string;
  /** '' anyone, 'me' the signed-in member, otherwise an owner's id. */
  owner: string;
  sort: Sort;
  /** 0-based, as the paginator counts. */
  pageIndex: number;
  pageSize: number;
}

export const DEFAULT_VIEW: LibraryView = {
  search: '',
  kind: '',
  status: '',
  job: '',
  owner: '',
  sort: { active: 'updatedAt', direction: 'desc' },
  pageIndex: 0,
  pageSize: 25,
};

/** Longest search and job text the filters take (as their boxes' maxlength). */
const MAX_SEARCH = 100;
const MAX_JOB = 80;

/**
 * The view a library address asks for (`/library?kind=taper&status=released&page=2`…), so the
 * list comes back as it was after opening a set-up and going back, and can be bookmarked or sent.
 * A parameter that is not one the page offers (an unknown area, page 0, a page size not offered)
 * is ignored: that filter stays at its default.
 */
export function viewFromParams(get: (name: string) => string | null): LibraryView {
  const one = <T extends string>(name: string, allowed: readonly T[]): T | '' => {
    const v = get(name);
    return v !== null && (allowed as readonly string[]).includes(v) ? (v as T) : '';
  };
  const whole = (name: string): number | null => {
    const v = get(name);
    return v !== null && /^[1-9]\d{0,5}$/.test(v) ? Number(v) : null;
  };
  const owner = get('owner');
  const sort = one('sort', SETUP_SORTS);
  const dir = one('dir', ['asc', 'desc'] as const);
  const size = whole('size');
  return {
    search: (get('q') ?? '').slice(0, MAX_SEARCH),
    kind: one('kind', SETUP_KINDS),
    status: one('status', SETUP_STATUSES),
    job: (get('job') ?? '').slice(0, MAX_JOB),
    owner: owner === 'me' || (owner !== null && /^[1-9]\d{0,9}$/.test(owner)) ? owner : '',
    sort: { active: sort || DEFAULT_VIEW.sort.active, direction: dir || (sort ? 'asc' : DEFAULT_VIEW.sort.direction) },
    pageIndex: (whole('page') ?? 1) - 1,
    pageSize: size !== null && (PAGE_SIZES as readonly number[]).includes(size) ? size : DEFAULT_VIEW.pageSize,
  };
}

/** The address parameters of a view: only what differs from the default, so a plain list is plain `/library`. */
export function paramsOfView(view: LibraryView): Params {
  const params: Params = {};
  if (view.search.trim()) params['q'] = view.search.trim();
  if (view.kind) params['kind'] = view.kind;
  if (view.status) params['status'] = view.status;
  if (view.job.trim()) params['job'] = view.job.trim();
  if (view.owner) params['owner'] = view.owner;
  const sorted = view.sort.direction ? view.sort : DEFAULT_VIEW.sort;
  if (sorted.active !== DEFAULT_VIEW.sort.active || sorted.direction !== DEFAULT_VIEW.sort.direction) {
    params['sort'] = sorted.active;
    params['dir'] = sorted.direction;
  }
  if (view.pageIndex > 0) params['page'] = String(view.pageIndex + 1);
  if (view.pageSize !== DEFAULT_VIEW.pageSize) params['size'] = String(view.pageSize);
  return params;
}

/** Whether two views ask for the same list. */
export function sameView(a: LibraryView, b: LibraryView): boolean {
  return JSON.stringify(paramsOfView(a)) === JSON.stringify(paramsOfView(b));
}

/** The navigation state a list row hands to the set-up it opens: the list's address parameters. */
export interface LibraryReturnState {
  readonly libraryList: Params;
}

/**
 * The list's address parameters a set-up page was opened with (navigation state), checked as an
 * address is, for its "Set-up library" link: so going back finds the list as it was. Empty (the
 * plain list) for anything else.
 */
export function returnParams(state: unknown): Params {
  const list = typeof state === 'object' && state !== null ? (state as Partial<LibraryReturnState>).libraryList : undefined;
  if (typeof list !== 'object' || list === null) return {};
  const get = (name: string): string | null => {
    const v: unknown = (list as Record<string, unknown>)[name];
    return typeof v === 'string' ? v : null;
  };
  return paramsOfView(viewFromParams(get));
}
