import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FieldRecordBody } from '../../../../shared/api/field-records.schema';
import { fieldRecordOutbox } from '../field-record-outbox';

/** Record a piece of work the offline-first way (as a survey): keep it in the outbox, then try to send the outbox. */
export function useSubmitFieldRecord() {
  const queryClient = useQueryClient();
  return useMutation({
    networkMode: 'always',
    mutationFn: async (record: FieldRecordBody) => {
      const outbox = fieldRecordOutbox();
      outbox.add(record);
      const result = await outbox.flush();
      return { sent: result.sent.some((r) => r.id === record.id), result };
    },
    onSuccess: ({ result }) => {
      if (result.sent.length) void queryClient.invalidateQueries({ queryKey: ['field-records'] });
    },
  });
}
