import { useOutbox } from '../surveys/use-survey-outbox';
import { fieldRecordOutbox } from './field-record-outbox';

/** The field records kept on this device, kept current; sent when the page opens and when the browser is back online. */
export const useFieldRecordOutbox = () => useOutbox(fieldRecordOutbox(), ['field-records']);
