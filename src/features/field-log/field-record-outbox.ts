import { fieldRecordDto, type FieldRecordBody, type FieldRecordDto } from '../../../shared/api/field-records.schema';
import { Outbox } from '../surveys/offline-queue';

/** Where the Field log keeps records not yet accepted by the server (the surveys' queue, its own key). */
export const FIELD_RECORDS_OUTBOX_KEY = 'broodcast.field-records.outbox.v1';

/** The outbox of field records: the surveys' offline queue and idempotency key (the browser-made id), reused. */
export class FieldRecordOutbox extends Outbox<FieldRecordBody, FieldRecordDto> {
  constructor(storage?: Pick<Storage, 'getItem' | 'setItem'>, fetchFn?: typeof fetch) {
    super({ storageKey: FIELD_RECORDS_OUTBOX_KEY, url: '/api/field-records', dto: fieldRecordDto }, storage, fetchFn);
  }
}

let shared: FieldRecordOutbox | null = null;
/** The browser's outbox of field records. */
export const fieldRecordOutbox = () => (shared ??= new FieldRecordOutbox());
