import { idParams } from '../../shared/api/common.schema';
import { fieldRecordBody, fieldRecordsQuery } from '../../shared/api/field-records.schema';
import { FIELD_RECORD_ACCESS } from '../../shared/field/field-records';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { FieldRecordsService } from './field-records.service';

/** The Field log (issue 19): records of field work, and the District file's timeline of it. Who: FIELD_RECORD_ACCESS. */
export function fieldRecordsRoutes(ctx: AppContext) {
  const service = new FieldRecordsService(ctx);
  return [
    defineRoute({
      method: 'post', path: '/field-records', access: FIELD_RECORD_ACCESS.record, body: fieldRecordBody,
      handler: async ({ principal, body }, _req, res) => {
        const { created, record } = await service.submit(principal, body);
        // 201 the first time, 200 with the stored record when the browser sends the same id again.
        res.status(created ? 201 : 200).json(record);
      },
    }),
    defineRoute({
      method: 'get', path: '/field-records', access: FIELD_RECORD_ACCESS.read, query: fieldRecordsQuery,
      handler: ({ principal, query }) => service.list(principal, query),
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/field-work', access: FIELD_RECORD_ACCESS.read, params: idParams,
      handler: ({ principal, params }) => service.districtTimeline(principal, params.id),
    }),
  ];
}
