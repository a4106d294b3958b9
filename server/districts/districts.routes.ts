import { idParams } from '../../shared/api/common.schema';
import { boundaryBody, boundaryQuery, districtCreateBody, districtUpdateBody, populationBody } from '../../shared/api/districts.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { DistrictsService } from './districts.service';
import { regionsResponse } from '../../shared/api/regions.schema';
import { boundariesResponse, districtDto, districtsResponse } from '../../shared/api/districts.schema';

export function districtsRoutes(ctx: AppContext) {
  const service = new DistrictsService(ctx);
  return [
    defineRoute({ method: 'get', path: '/districts', access: 'signed-in', response: districtsResponse, handler: ({ principal }) => service.list(principal) }),
    defineRoute({ method: 'get', path: '/regions', access: 'signed-in', response: regionsResponse, handler: () => service.regions() }),
    defineRoute({
      method: 'get', path: '/districts/boundaries', access: 'signed-in', response: boundariesResponse,
      handler: ({ principal }) => service.boundaries(principal),
    }),
    defineRoute({
      method: 'get', path: '/districts/:id', access: 'signed-in', response: districtDto, params: idParams,
      handler: ({ principal, params }) => service.get(principal, params.id),
    }),
    defineRoute({
      method: 'post', path: '/districts', access: 'districts.manage', response: districtDto, body: districtCreateBody, status: 201,
      handler: ({ principal, body }) => service.create(principal, body),
    }),
    defineRoute({
      method: 'patch', path: '/districts/:id', access: 'districts.manage', response: districtDto, params: idParams, body: districtUpdateBody,
      handler: ({ principal, params, body }) => service.update(principal, params.id, body),
    }),
    defineRoute({
      method: 'put', path: '/districts/:id/populations', access: 'districts.manage', response: districtDto, params: idParams, body: populationBody,
      handler: ({ principal, params, body }) => service.setPopulation(principal, params.id, body),
    }),
    defineRoute({
      method: 'put', path: '/districts/:id/boundary', access: 'districts.manage', response: districtDto, params: idParams, query: boundaryQuery, body: boundaryBody,
      handler: ({ principal, params, query, body }) => service.setBoundary(principal, params.id, body, { confirm: query.confirm === 'true' }),
    }),
  ];
}
