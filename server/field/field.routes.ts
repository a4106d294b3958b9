import { idParams } from '../../shared/api/common.schema';
import { fieldSettingsBody, fieldTeamBody, fieldWeekDaysBody, fieldWeekProposalBody, fieldWeekQuery, sendBackFieldWeekBody } from '../../shared/api/field.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { FieldSettingsService } from './field-settings.service';
import { FieldTeamsService } from './field-teams.service';
import { FieldWeeksService } from './field-weeks.service';
import { awaitingFieldWeeksResponse, fieldSettingsDto, fieldTeamCandidatesResponse, fieldTeamDto, fieldTeamsResponse, fieldWeekDto, fieldWeekResponse } from '../../shared/api/field.schema';

/** Field teams and the Field week (issue 19). Who may call what: the field.* rows of shared/permissions.ts. */
export function fieldRoutes(ctx: AppContext) {
  const teams = new FieldTeamsService(ctx);
  const weeks = new FieldWeeksService(ctx);
  const settings = new FieldSettingsService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/field-teams', access: 'field.seeTeams', response: fieldTeamsResponse,
      handler: ({ principal }) => teams.list(principal),
    }),
    defineRoute({
      method: 'get', path: '/field-teams/candidates', access: 'field.manageTeams', response: fieldTeamCandidatesResponse,
      handler: () => teams.candidates(),
    }),
    defineRoute({
      method: 'post', path: '/field-teams', access: 'field.manageTeams', response: fieldTeamDto, body: fieldTeamBody, status: 201,
      handler: ({ principal, body }) => teams.create(principal, body),
    }),
    defineRoute({
      method: 'put', path: '/field-teams/:id', access: 'field.manageTeams', response: fieldTeamDto, params: idParams, body: fieldTeamBody,
      handler: ({ principal, params, body }) => teams.update(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/field-teams/:id/retire', access: 'field.manageTeams', response: fieldTeamDto, params: idParams,
      handler: ({ principal, params }) => teams.retire(principal, params.id),
    }),
    defineRoute({
      method: 'delete', path: '/field-teams/:id', access: 'field.manageTeams', response: 'empty', params: idParams,
      handler: async ({ principal, params }) => { await teams.remove(principal, params.id); },
    }),
    defineRoute({
      method: 'get', path: '/field-weeks', access: 'field.seeWeek', response: fieldWeekResponse, query: fieldWeekQuery,
      handler: ({ principal, query }) => weeks.get(principal, query.weekStart),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/proposal', access: 'field.plan', response: fieldWeekDto, body: fieldWeekProposalBody,
      handler: ({ principal, body }) => weeks.propose(principal, body),
    }),
    defineRoute({
      method: 'put', path: '/field-weeks/:id/days', access: 'field.plan', response: fieldWeekDto, params: idParams, body: fieldWeekDaysBody,
      handler: ({ principal, params, body }) => weeks.saveDays(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/:id/publish', access: 'field.plan', response: fieldWeekDto, params: idParams,
      handler: ({ principal, params }) => weeks.publish(principal, params.id),
    }),
    defineRoute({
      method: 'get', path: '/field-weeks/awaiting', access: 'field.approve', response: awaitingFieldWeeksResponse,
      handler: () => weeks.awaiting(),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/:id/approve', access: 'field.approve', response: fieldWeekDto, params: idParams,
      handler: ({ principal, params }) => weeks.approve(principal, params.id),
    }),
    defineRoute({
      method: 'post', path: '/field-weeks/:id/send-back', access: 'field.approve', response: fieldWeekDto, params: idParams, body: sendBackFieldWeekBody,
      handler: ({ principal, params, body }) => weeks.sendBack(principal, params.id, body),
    }),
    defineRoute({
      method: 'get', path: '/field-settings', access: 'field.settings', response: fieldSettingsDto,
      handler: () => settings.get(),
    }),
    defineRoute({
      method: 'put', path: '/field-settings', access: 'field.settings', response: fieldSettingsDto, body: fieldSettingsBody,
      handler: ({ principal, body }) => settings.update(principal, body),
    }),
  ];
}
