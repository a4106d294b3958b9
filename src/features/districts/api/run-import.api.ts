import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { districtImportReport, importReport, type DistrictImportReport } from '../../../../shared/api/imports.schema';
import { ApiError, errorFromResponse } from '../../../lib/api-client';

export type ImportKind = 'districts' | 'stations' | 'populations';
const PATHS: Record<ImportKind, string> = {
  districts: '/api/districts/import',
  stations: '/api/weather/stations/import',
  populations: '/api/districts/populations/import',
};

/** A refused import: the API error plus the full report (nothing was written). */
export class ImportRefused extends ApiError {
  constructor(error: ApiError, readonly report: DistrictImportReport | null) {
    super(error.status, error.code, error.message, error.fields, error.params);
  }
}

export interface ImportVariables {
  kind: ImportKind;
  file: File;
  /** Form fields (the district file's property mapping); empty values are left out. */
  fields: Record<string, string>;
  dryRun: boolean;
  skipProblems: boolean;
}

const anyReport = importReport.extend({ regions: districtImportReport.shape.regions.optional(), properties: z.array(z.string()).default([]) });

/**
 * POST /api/districts/import, /api/weather/stations/import or /api/districts/populations/import (admin),
 * multipart — the shared api client sends JSON only, so this call builds its own FormData request.
 */
export async function runImport({ kind, file, fields, dryRun, skipProblems }: ImportVariables): Promise<DistrictImportReport> {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) if (v.trim()) form.append(k, v.trim());
  form.append('file', file);
  const query = new URLSearchParams();
  if (dryRun) query.set('dryRun', 'true');
  if (skipProblems) query.set('skipProblems', 'true');
  let response: Response;
  try {
    response = await fetch(`${PATHS[kind]}${query.size ? `?${query}` : ''}`, { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'network_error', 'Broodcast could not reach its server. Check the connection and try again.');
  }
  const parse = (x: unknown) => {
    const r = anyReport.parse(x);
    return { ...r, regions: r.regions ?? { created: 0, updated: 0 } };
  };
  if (response.ok) return parse(await response.json());
  const copy = response.clone();
  const error = await errorFromResponse(response);
  const body = z.object({ report: z.unknown() }).safeParse(await copy.json().catch(() => null));
  throw new ImportRefused(error, body.success ? parse(body.data.report) : null);
}

export function useRunImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runImport,
    onSuccess: (_r, v) => {
      if (v.dryRun) return;
      void queryClient.invalidateQueries({ queryKey: ['districts'] });
      void queryClient.invalidateQueries({ queryKey: ['regions'] });
      void queryClient.invalidateQueries({ queryKey: ['weather'] });
    },
  });
}
