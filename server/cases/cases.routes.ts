import multer from 'multer';
import { idParams } from '../../shared/api/common.schema';
import {
  caseCountBody,
  caseUploadFields,
  channelSettingsBody,
  closeWeekBody, reopenWeekBody,
  countQuery,
  diseaseCreateBody,
  districtCasesQuery,
  gridQuery,
} from '../../shared/api/cases.schema';
import { voidBody } from '../../shared/api/void.schema';
import type { AppContext } from '../app-context';
import { badRequest } from '../http/errors';
import { defineRoute, type RouteDef } from '../http/route';
import { checkCsvUpload, uploadLimit } from '../http/uploads';
import { CaseLedgerService } from './case-ledger.service';
import { CaseUploadService, UPLOAD_MAX_BYTES } from './case-upload.service';
import { surveysRoutes } from './surveys.routes';
import { caseCountResult, casesSettingsResponse, closureResponse, countResponse, diseaseDto, diseasesResponse, gridResponse, reopenResponse, revisionsResponse, signalsResponse, uploadReport, voidCountResponse } from '../../shared/api/cases.schema';

/** Case ledger and field survey routes. */
export function casesRoutes(ctx: AppContext): RouteDef[] {
  const ledger = new CaseLedgerService(ctx);
  const uploads = new CaseUploadService(ctx, ledger);
  // Memory storage: the file is parsed and dropped; it never touches the disk (the size limit bounds memory).
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 5 } });
  return [
    defineRoute({ method: 'get', path: '/diseases', access: 'signed-in', response: diseasesResponse, handler: () => ledger.listDiseases() }),
    defineRoute({
      method: 'post', path: '/diseases', access: 'diseases.manage', response: diseaseDto, body: diseaseCreateBody, status: 201,
      handler: ({ principal, body }) => ledger.createDisease(principal, body),
    }),
    defineRoute({ method: 'get', path: '/cases/settings', access: 'signed-in', response: casesSettingsResponse, handler: () => ledger.settings() }),
    defineRoute({
      method: 'get', path: '/cases/grid', access: 'signed-in', response: gridResponse, query: gridQuery,
      handler: ({ principal, query }) => ledger.grid(principal, query),
    }),
    defineRoute({
      method: 'post', path: '/cases/uploads', access: 'cases.enter', response: uploadReport, before: [uploadLimit(UPLOAD_MAX_BYTES), upload.single('file'), checkCsvUpload], body: caseUploadFields,
      handler: async ({ principal, body }, req, res) => {
        if (!req.file) throw badRequest('file_missing', 'Attach a CSV file in the field "file".', [{ path: 'file', message: 'is required' }]);
        const report = await uploads.upload(principal, req.file, body.reason);
        if (report.accepted) return report;
        // Refused: the usual error body (so every client reads it the same way) plus the full row report.
        res.status(422).json({
          error: {
            code: 'upload_rejected',
            message: `The file was not loaded: ${report.problems.length} problem${report.problems.length === 1 ? '' : 's'}. Nothing was written.`,
            fields: report.problems.map((p) => ({ path: `row ${p.row}${p.column ? `, ${p.column}` : ''}`, message: p.reason })),
          },
          report,
        });
      },
    }),
    defineRoute({
      method: 'post', path: '/cases/counts/:id/void', access: 'cases.enter', response: voidCountResponse, params: idParams, body: voidBody,
      handler: ({ principal, params, body }) => ledger.voidCount(principal, params.id, body.reason),
    }),
    defineRoute({
      method: 'get', path: '/cases/counts/:id/revisions', access: 'cases.readHistory', response: revisionsResponse, params: idParams,
      handler: ({ principal, params }) => ledger.revisions(principal, params.id),
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/cases', access: 'signed-in', response: signalsResponse, params: idParams, query: districtCasesQuery,
      handler: ({ principal, params, query }) => ledger.signals(principal, params.id, query),
    }),
    defineRoute({
      method: 'get', path: '/districts/:id/cases/count', access: 'signed-in', response: countResponse, params: idParams, query: countQuery,
      handler: ({ principal, params, query }) => ledger.storedCount(principal, params.id, query),
    }),
    defineRoute({
      method: 'put', path: '/districts/:id/cases', access: 'cases.enter', response: caseCountResult, params: idParams, body: caseCountBody,
      handler: ({ principal, params, body }) => ledger.putCount(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/districts/:id/weeks/close', access: 'cases.closeWeek', response: closureResponse, params: idParams, body: closeWeekBody,
      handler: ({ principal, params, body }) => ledger.closeWeek(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/districts/:id/weeks/reopen', access: 'cases.closeWeek', response: reopenResponse, params: idParams, body: reopenWeekBody,
      handler: ({ principal, params, body }) => ledger.reopenWeek(principal, params.id, body),
    }),
    defineRoute({
      method: 'put', path: '/districts/:id/channel-settings', access: 'cases.channelSettings', params: idParams, body: channelSettingsBody,
      handler: ({ principal, params, body }) => ledger.setChannelSettings(principal, params.id, body),
    }),
    ...surveysRoutes(ctx),
  ];
}
