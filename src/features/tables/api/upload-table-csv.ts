import { useMutation, useQueryClient } from '@tanstack/react-query';
import { idResponseSchema } from '../../../../shared/contracts/scenarios-api.ts';
import { postCsvForm } from './post-csv-form.ts';
import { tablesKey } from './get-tables.ts';

export interface UploadTableInput {
  file: File;
  name: string;
  description?: string;
}

/** Stores a CSV as a new table; nothing is stored if any row has a problem (400 with the report in `details`). */
export function uploadTableCsv({ file, name, description }: UploadTableInput) {
  return postCsvForm('/api/occurrence-tables/upload', file, { name, ...(description ? { description } : {}) }, idResponseSchema);
}

export function useUploadTableCsv(departmentId: string) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadTableCsv, onSuccess: () => queryClient.invalidateQueries({ queryKey: tablesKey(departmentId) }) });
}
