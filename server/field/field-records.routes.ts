import { idParams } from '../../shared/api/common.schema';
import { districtFieldWorkResponse, fieldRecordBody, fieldRecordDto, fieldRecordsQuery, fieldRecordsResponse } from '../../shared/api/field-records.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { FieldRecordsService } from './field-records.service';

/** The Field log (issue 19): records of field work, and the District file's timeline of it. Who: the fieldRecords.* rows of shared/permissions.ts. */
export function fieldRecordsRoutes(ctx: AppContext) {
  const service = new FieldRecordsService(ctx);
  return [
    defineRoute({
      method: 'post', path: '/field-records', access: 'fieldRecords.record', response: fieldRecordDto, body: fieldRecordBody,
      handler: async ({ principal, body }, _req, res) => {
        const { created, record } = await service.submit(principal, body);
        // 201 the first time, 200 with the stored record when the browser sends the same id again.
        res.status(created ? 201 : 200).json(record);
      },
    }),
    defineRoute({
      method: 'get', path: '/field-records', access: 'fieldRecords.read', response: fieldRecordsResponse, query: fieldRecordsQuery,
      handler: ({ principal, query }) => service.list(principal, query),
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/field-work', access: 'fieldRecords.read', response: districtFieldWorkResponse, params: idParams,
      handler: ({ principal, params }) => service.districtTimeline(principal, params.id),
    }),
  ];
}
