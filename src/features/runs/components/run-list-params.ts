import { RUN_SORT_FIELDS, RUN_STATUSES, type RunStatus } from '../../../../shared/contracts/runs.ts';
import type { RunListParams } from '../api/get-runs.ts';

export const PAGE_SIZES = [10, 20, 50] as const;
export const DEFAULT_PAGE_SIZE = 20;
type SortField = (typeof RUN_SORT_FIELDS)[number];

export interface RunListState {
  status: RunStatus | null;
  q: string;
  mine: boolean;
  sort: SortField;
  order: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

export const DEFAULT_RUN_LIST_STATE: RunListState = { status: null, q: '', mine: false, sort: 'createdAt', order: 'desc', page: 1, pageSize: DEFAULT_PAGE_SIZE };

const oneOf = <T extends string>(values: readonly T[], value: string | null): T | null =>
  value !== null && (values as readonly string[]).includes(value) ? (value as T) : null;

/** The table's state from the address bar (?status=running&mine=1&sort=systems&order=asc&page=2); bad values fall back to defaults. */
export function runListStateFromSearch(search: URLSearchParams): RunListState {
  const d = DEFAULT_RUN_LIST_STATE;
  const page = Number(search.get('page'));
  const pageSize = Number(search.get('pageSize'));
  return {
    status: oneOf(RUN_STATUSES, search.get('status')),
    q: (search.get('q') ?? '').slice(0, 100),
    mine: search.get('mine') === '1',
    sort: oneOf(RUN_SORT_FIELDS, search.get('sort')) ?? d.sort,
    order: oneOf(['asc', 'desc'] as const, search.get('order')) ?? d.order,
    page: Number.isInteger(page) && page >= 1 ? page : d.page,
    pageSize: (PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : d.pageSize,
  };
}

/** The address-bar form of a state, leaving defaults out so that links stay short. */
export function searchFromRunListState(state: RunListState): URLSearchParams {
  const d = DEFAULT_RUN_LIST_STATE;
  const search = new URLSearchParams();
  if (state.status) search.set('status', state.status);
  if (state.q.trim()) search.set('q', state.q.trim());
  if (state.mine) search.set('mine', '1');
  if (state.sort !== d.sort) search.set('sort', state.sort);
  if (state.order !== d.order) search.set('order', state.order);
  if (state.page !== d.page) search.set('page', String(state.page));
  if (state.pageSize !== d.pageSize) search.set('pageSize', String(state.pageSize));
  return search;
}

/** What GET /api/runs is asked for this state. */
export function runListParams(state: RunListState): RunListParams {
  return {
    page: state.page,
    pageSize: state.pageSize,
    sort: state.sort,
    order: state.order,
    status: state.status ?? undefined,
    q: state.q.trim() || undefined,
    owner: state.mine ? 'me' : 'any',
  };
}

/** A click on a column header: the same column flips its order; another starts with its natural order. */
export function toggleSort(state: RunListState, sort: SortField): RunListState {
  if (state.sort === sort) return { ...state, order: state.order === 'asc' ? 'desc' : 'asc', page: 1 };
  // Text and status read A→Z; sizes, fractions and dates are most useful largest or newest first.
  const natural = sort === 'scenarioName' || sort === 'status' ? 'asc' : 'desc';
  return { ...state, sort, order: natural, page: 1 };
}

export const hasFilters = (state: RunListState) => state.status !== null || state.q.trim() !== '' || state.mine;
