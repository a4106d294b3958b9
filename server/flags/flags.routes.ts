import { advisoriesQuery, approveFlagBody, flagSettingsBody, flagsQuery, raiseFlagBody, rejectFlagBody } from '../../shared/api/flags.schema';
import { idParams } from '../../shared/api/common.schema';
import { AdvisoriesService } from '../advisories/advisories.service';
import type { AppContext } from '../app-context';
import { defineRoute, type RouteDef } from '../http/route';
import { FlagSettingsService } from './flag-settings.service';
import { FlagsService } from './flags.service';
import { advisoriesResponse, flagDetailResponse, flagDto, flagSettingsDto, flagsResponse } from '../../shared/api/flags.schema';

/** Flags (raise by hand, the sign-off queue, approve / reject) and the advisories they became. */
export function flagsRoutes(ctx: AppContext): RouteDef[] {
  const flags = new FlagsService(ctx);
  const advisories = new AdvisoriesService(ctx);
  const settings = new FlagSettingsService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/flags', access: 'flags.read', response: flagsResponse, query: flagsQuery,
      handler: ({ query }) => flags.list(query),
    }),
    defineRoute({
      method: 'post', path: '/flags', access: 'flags.raise', response: flagDto, body: raiseFlagBody, status: 201,
      handler: ({ principal, body }) => flags.raise(principal, body),
    }),
    defineRoute({
      method: 'get', path: '/flags/:id', access: 'flags.read', response: flagDetailResponse, params: idParams,
      handler: ({ params }) => flags.detail(params.id),
    }),
    defineRoute({
      method: 'post', path: '/flags/:id/approve', access: 'flags.signOff', response: flagDto, params: idParams, body: approveFlagBody,
      handler: ({ principal, params, body }) => flags.approve(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/flags/:id/reject', access: 'flags.signOff', response: flagDto, params: idParams, body: rejectFlagBody,
      handler: ({ principal, params, body }) => flags.reject(principal, params.id, body),
    }),
    defineRoute({
      method: 'get', path: '/flag-settings', access: 'flagSettings.manage', response: flagSettingsDto,
      handler: () => settings.get(),
    }),
    defineRoute({
      method: 'put', path: '/flag-settings', access: 'flagSettings.manage', response: flagSettingsDto, body: flagSettingsBody,
      handler: ({ principal, body }) => settings.update(principal, body),
    }),
    defineRoute({
      method: 'get', path: '/advisories', access: 'signed-in', response: advisoriesResponse, query: advisoriesQuery,
      handler: ({ principal, query }) => advisories.list(principal, query),
    }),
  ];
}
