import { idParams } from '../../shared/api/common.schema';
import { preferencesBody, userInviteBody, userUpdateBody } from '../../shared/api/users.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { UsersService } from './users.service';
import { userDto, usersResponse } from '../../shared/api/users.schema';
import { preferencesDto } from '../../shared/api/auth.schema';

export function usersRoutes(ctx: AppContext) {
  const service = new UsersService(ctx);
  return [
    defineRoute({ method: 'get', path: '/users', access: 'users.manage', response: usersResponse, handler: () => service.list() }),
    defineRoute({
      method: 'post', path: '/users', access: 'users.manage', response: userDto, body: userInviteBody, status: 201,
      handler: ({ principal, body }) => service.invite(principal, body),
    }),
    defineRoute({
      method: 'patch', path: '/users/:id', access: 'users.manage', response: userDto, params: idParams, body: userUpdateBody,
      handler: ({ principal, params, body }) => service.update(principal, params.id, body),
    }),
    defineRoute({
      // Every signed-in user sets their own language and display units (docs/flags-and-bulletins.md: mail goes out in it).
      method: 'patch', path: '/me/preferences', access: 'signed-in', response: preferencesDto, body: preferencesBody,
      handler: ({ principal, body }) => service.updatePreferences(principal, body),
    }),
  ];
}
