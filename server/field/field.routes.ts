import { idParams } from '../../shared/api/common.schema';
import { fieldSettingsBody, fieldTeamBody, fieldWeekDaysBody, fieldWeekProposalBody, fieldWeekQuery, sendBackFieldWeekBody } from '../../shared/api/field.schema';
import { FIELD_ACCESS } from '../../shared/field/work-kinds';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { FieldSettingsService } from './field-settings.service';
import { FieldTeamsService } from './field-teams.service';
import { FieldWeeksService } from './field-weeks.service';

/** Field teams and the Field week (issue 19). Who may call what: FIELD_ACCESS in shared/field/work-kinds.ts. */
export function fieldRoutes(ctx: AppContext) {
  const teams = new FieldTeamsService(ctx);
  const weeks = new FieldWeeksService(ctx);
  const settings = new FieldSettingsService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/field-teams', access: FIELD_ACCESS.seeTeams,
      handler: ({ principal }) => teams.list(principal),
    }),
    defineRoute({
      method: 'get', path: '/field-teams/candidates', access: FIELD_ACCESS.manageTeams,
      handler: () => teams.candidates(),
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
      method: 'post', path: '/field-teams/:id/retire', access: FIELD_ACCESS.manageTeams, params: idParams,
      handler: ({ principal, params }) => teams.retire(principal, params.id),
    }),
    defineRoute({
      method: 'delete', path: '/field-teams/:id', access: FIELD_ACCESS.manageTeams, params: idParams,
      handler: async ({ principal, params }) => { await teams.remove(principal, params.id); },
    }),
    defineRoute({
      method: 'get', path: '/field-weeks', access: FIELD_ACCESS.seeWeek, query: fieldWeekQuery,
      handler: ({ principal, query }) => weeks.get(principal, query.weekStart),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/proposal', access: FIELD_ACCESS.planWeek, body: fieldWeekProposalBody,
      handler: ({ principal, body }) => weeks.propose(principal, body),
    }),
    defineRoute({
      method: 'put', path: '/field-weeks/:id/days', access: FIELD_ACCESS.planWeek, params: idParams, body: fieldWeekDaysBody,
      handler: ({ principal, params, body }) => weeks.saveDays(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/:id/publish', access: FIELD_ACCESS.planWeek, params: idParams,
      handler: ({ principal, params }) => weeks.publish(principal, params.id),
    }),
    defineRoute({
      method: 'get', path: '/field-weeks/awaiting', access: FIELD_ACCESS.approveWeek,
      handler: () => weeks.awaiting(),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/:id/approve', access: FIELD_ACCESS.approveWeek, params: idParams,
      handler: ({ principal, params }) => weeks.approve(principal, params.id),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/:id/send-back', access: FIELD_ACCESS.approveWeek, params: idParams, body: sendBackFieldWeekBody,
      handler: ({ principal, params, body }) => weeks.sendBack(principal, params.id, body),
    }),
    defineRoute({
      method: 'get', path: '/field-settings', access: FIELD_ACCESS.settings,
      handler: () => settings.get(),
    }),
    defineRoute({
      method: 'put', path: '/field-settings', access: FIELD_ACCESS.settings, body: fieldSettingsBody,
      handler: ({ principal, body }) => settings.update(principal, body),
    }),
  ];
}
