import { useMutation } from '@tanstack/react-query';
import { tablePreviewResponseSchema } from '../../../../shared/contracts/occurrence-tables-api.ts';
import { postCsvForm } from './post-csv-form.ts';

/** Checks a CSV without storing it: the rows as understood and every problem with its line and column. */
export function previewTableCsv(file: File) {
  return postCsvForm('/api/occurrence-tables/preview', file, {}, tablePreviewResponseSchema);
}

export function usePreviewTableCsv() {
  return useMutation({ mutationFn: previewTableCsv });
}
