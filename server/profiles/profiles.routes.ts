import { z } from 'zod';
import { assignProfilesBody, profileVariantBody } from '../../shared/api/profiles.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { ProfilesService } from './profiles.service';
import { assignProfilesResponse, profileDto, profilesResponse } from '../../shared/api/profiles.schema';

const profileIdParams = z.strictObject({ id: z.string().min(1).max(100) });

export function profilesRoutes(ctx: AppContext) {
  const service = new ProfilesService(ctx);
  return [
    defineRoute({ method: 'get', path: '/profiles', access: 'signed-in', response: profilesResponse, handler: () => service.list() }),
    defineRoute({
      method: 'put', path: '/districts/profiles', access: 'profiles.manage', response: assignProfilesResponse, body: assignProfilesBody,
      handler: ({ principal, body }) => service.assign(principal, body),
    }),
    // No PUT/PATCH on /profiles/:id: a published profile is never edited in place, only copied.
    defineRoute({
      method: 'post', path: '/profiles/:id/variants', access: 'profiles.manage', response: profileDto, params: profileIdParams, body: profileVariantBody, status: 201,
      handler: ({ principal, params, body }) => service.createVariant(principal, params.id, body),
    }),
  ];
}
