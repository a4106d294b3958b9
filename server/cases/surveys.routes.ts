import { idParams } from '../../shared/api/common.schema';
import { surveyBody } from '../../shared/api/surveys.schema';
import { voidBody } from '../../shared/api/void.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { LarvalSurveysService } from './larval-surveys.service';
import { districtSurveysResponse, surveyDto } from '../../shared/api/surveys.schema';

/** Larval surveys from the field. */
export function surveysRoutes(ctx: AppContext) {
  const service = new LarvalSurveysService(ctx);
  return [
    defineRoute({
      method: 'post', path: '/surveys', access: 'surveys.record', response: surveyDto, body: surveyBody,
      handler: async ({ principal, body }, _req, res) => {
        const { created, survey } = await service.submit(principal, body);
        // 201 the first time, 200 with the stored survey when the browser sends the same id again.
        res.status(created ? 201 : 200).json(survey);
      },
    }),
    defineRoute({
      method: 'post', path: '/surveys/:id/void', access: 'surveys.record', response: surveyDto, params: idParams, body: voidBody,
      handler: ({ principal, params, body }) => service.voidSurvey(principal, params.id, body.reason),
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/surveys', access: 'signed-in', response: districtSurveysResponse, params: idParams,
      handler: ({ principal, params }) => service.listForDistrict(principal, params.id),
    }),
  ];
}
