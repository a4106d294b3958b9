import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { uploadReport, type UploadReport } from '../../../../shared/api/cases.schema';
import { ApiError, errorFromResponse } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

/** A refused upload: the API error plus the row-level report. */
export class UploadRejected extends ApiError {
  constructor(
    error: ApiError,
    readonly report: UploadReport | null,
  ) {
    super(error.status, error.code, error.message, error.fields);
  }
}

/**
 * POST /api/cases/uploads (multipart/form-data) — a CSV of district, year, week, disease, cases. The
 * shared api client sends JSON only, so this one call builds its own FormData request.
 */
export async function uploadCases({ file, reason }: { file: File; reason?: string }): Promise<UploadReport> {
  const form = new FormData();
  form.append('file', file);
  if (reason?.trim()) form.append('reason', reason.trim());
  let response: Response;
  try {
    response = await fetch('/api/cases/uploads', { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'network_error', 'Broodcast could not reach its server. Check the connection and try again.');
  }
  if (response.ok) return uploadReport.parse(await response.json());
  const copy = response.clone();
  const error = await errorFromResponse(response);
  const body = z.object({ report: uploadReport }).safeParse(await copy.json().catch(() => null));
  throw new UploadRejected(error, body.success ? body.data.report : null);
}

export function useUploadCases() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: uploadCases, onSuccess: () => queryClient.invalidateQueries({ queryKey: casesKeys.all }) });
}
