import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { issuesResponse } from '../../../../shared/api/weather.schema';
import { api } from '../../../lib/api-client';
import { weatherKeys } from './weather-keys';

export const ISSUES_PAGE = 100;

/** GET /api/weather/uploads/:id/issues — one page of the row-level report. */
export const issuesQueryOptions = (id: string, offset: number) =>
  queryOptions({
    queryKey: weatherKeys.issues(id, offset),
    queryFn: ({ signal }) => api.get(`/api/weather/uploads/${encodeURIComponent(id)}/issues?offset=${offset}&limit=${ISSUES_PAGE}`, issuesResponse, signal),
    placeholderData: keepPreviousData,
  });
export const useIssues = (id: string, offset: number, enabled: boolean) => useQuery({ ...issuesQueryOptions(id, offset), enabled });

/**
 * The address of the report as a CSV download (cells neutralised for spreadsheets on the server), with
 * the values in the user's display units (`temperature=C|F&rain=mm|in`; left out for °C and mm, the
 * server's default).
 */
export const issuesCsvUrl = (id: string, units: { temperature: 'C' | 'F'; rain: 'mm' | 'in' } = { temperature: 'C', rain: 'mm' }) =>
  `/api/weather/uploads/${encodeURIComponent(id)}/issues?format=csv` +
  (units.temperature === 'C' && units.rain === 'mm' ? '' : `&temperature=${units.temperature}&rain=${units.rain}`);
