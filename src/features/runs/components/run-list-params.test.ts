import { describe, expect, it } from 'vitest';
import { DEFAULT_RUN_LIST_STATE, runListParams, runListStateFromSearch, searchFromRunListState, toggleSort } from './run-list-params.ts';

describe('run list state in the address bar', () => {
  it('round-trips and leaves the defaults out', () => {
    const state = { ...DEFAULT_RUN_LIST_STATE, status: 'running' as const, q: 'baseline', mine: true, sort: 'systems' as const, order: 'asc' as const, page: 3, pageSize: 50 };
    const search = searchFromRunListState(state);
    expect(search.toString()).toBe('status=running&q=baseline&mine=1&sort=systems&order=asc&page=3&pageSize=50');
    expect(runListStateFromSearch(search)).toEqual(state);
    expect(searchFromRunListState(DEFAULT_RUN_LIST_STATE).toString()).toBe('');
  });

  it('ignores values the server would refuse', () => {
    const state = runListStateFromSearch(new URLSearchParams('status=done&sort=owner&order=up&page=0&pageSize=7'));
    expect(state).toEqual(DEFAULT_RUN_LIST_STATE);
  });

  it('asks the server for "mine" as owner=me', () => {
    expect(runListParams({ ...DEFAULT_RUN_LIST_STATE, mine: true, q: '  ' })).toMatchObject({ owner: 'me', q: undefined, status: undefined });
  });
});

describe('toggleSort', () => {
  it('flips the same column and starts others in their natural order, on page 1', () => {
    const onPage2 = { ...DEFAULT_RUN_LIST_STATE, page: 2 };
    expect(toggleSort(onPage2, 'createdAt')).toMatchObject({ sort: 'createdAt', order: 'asc', page: 1 });
    expect(toggleSort(onPage2, 'scenarioName')).toMatchObject({ sort: 'scenarioName', order: 'asc' });
    expect(toggleSort(onPage2, 'fraction')).toMatchObject({ sort: 'fraction', order: 'desc' });
  });
});
