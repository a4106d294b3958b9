import { idParams } from '../../shared/api/common.schema';
import { fieldTeamBody } from '../../shared/api/field.schema';
import { FIELD_ACCESS } from '../../shared/field/work-kinds';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { FieldTeamsService } from './field-teams.service';

/** Field teams and the Field week (issue 19). Who may call what: FIELD_ACCESS in shared/field/work-kinds.ts. */
export function fieldRoutes(ctx: AppContext) {
  const teams = new FieldTeamsService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/field-teams', access: FIELD_ACCESS.seeTeams,
      handler: ({ principal }) => teams.list(principal),
    }),
    defineRoute({
      method: 'post', path: '/field-teams', access: FIELD_ACCESS.manageTeams, body: fieldTeamBody, status: 201,
      handler: ({ principal, body }) => teams.create(principal, body),
    }),
    defineRoute({
      method: 'put', path: '/field-teams/:id', access: FIELD_ACCESS.manageTeams, params: idParams, body: fieldTeamBody,
      handler: ({ principal, params, body }) => teams.update(principal, params.id, body),
    }),
    defineRoute({
      method: 'delete', path: '/field-teams/:id', access: FIELD_ACCESS.manageTeams, params: idParams,
      handler: async ({ principal, params }) => { await teams.remove(principal, params.id); },
    }),
  ];
}
