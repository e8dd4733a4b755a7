import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateTableBody } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { api } from '../../../lib/api-client.ts';
import { tablesKey } from './get-tables.ts';

/** Stores a table from rows given as JSON (an empty one to fill in, say). */
export function createTable(body: CreateTableBody) {
  return api.post('/api/occurrence-tables', { body, schema: idResponseSchema });
}

export function useCreateTable(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createTable, onSuccess: () => queryClient.invalidateQueries({ queryKey: tablesKey(departmentId) }) });
}
