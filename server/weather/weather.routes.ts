import { randomUUID } from 'node:crypto';
import { unlink } from 'node:fs';
import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { idParams } from '../../shared/api/common.schema';
import {
  confirmBody, conflictParams, correctionBody, resolveConflictBody, voidDayBody, issuesReportQuery, rangeQuery, revisionsQuery, stationCreateBody, stationUpdateBody, uploadForm, uploadQuery,
} from '../../shared/api/weather.schema';
import type { AppContext } from '../app-context';
import { defineRoute } from '../http/route';
import { checkCsvUpload, uploadLimit } from '../http/uploads';
import { WeatherFeedService } from './weather-feed.service';
import { uploadFolder } from './upload-dir';
import { WeatherService } from './weather.service';
import { confirmResponse, conflictsResponse, districtSeriesResponse, feedPullResponse, heldResponse, issuesResponse, resolveConflictResponse, revisionsResponse, stationDaysResponse, stationDto, stationsResponse, uploadDto, uploadsResponse } from '../../shared/api/weather.schema';

/** Weather intake routes (stations, uploads, corrections, the feed, district series). */
export function weatherRoutes(ctx: AppContext) {
  const service = new WeatherService(ctx);
  const feed = new WeatherFeedService(ctx);
  // The checkout's own .local/uploads/<pid> (leftovers of dead processes swept), or WEATHER_UPLOAD_DIR.
  const dir = uploadFolder(ctx.config.WEATHER_UPLOAD_DIR);
  // Disk storage under a generated name (never the client's file name), so a 200 MB file is never held in memory.
  const upload = multer({
    storage: multer.diskStorage({ destination: dir, filename: (_req, _file, cb) => cb(null, `${randomUUID()}.upload`) }),
    limits: { fileSize: ctx.config.WEATHER_UPLOAD_MAX_BYTES, files: 1, fields: 5, parts: 6 },
  }).single('file');
  // A file the handler did not take (the form failed validation) is deleted when the answer is sent.
  const dropUntaken = (req: Request, res: Response, next: NextFunction) => {
    res.once('close', () => {
      const file = req.file as (Express.Multer.File & { taken?: boolean }) | undefined;
      if (file?.path && !file.taken) unlink(file.path, () => undefined);
    });
    next();
  };

  return [
    defineRoute({ method: 'get', path: '/weather/stations', access: 'signed-in', response: stationsResponse, handler: ({ principal }) => service.stations(principal) }),
    defineRoute({
      method: 'post', path: '/weather/stations', access: 'weather.upload', response: stationDto, body: stationCreateBody, status: 201,
      handler: ({ principal, body }) => service.createStation(principal, body),
    }),
    defineRoute({
      method: 'patch', path: '/weather/stations/:id', access: 'weather.upload', response: stationDto, params: idParams, body: stationUpdateBody,
      handler: ({ principal, params, body }) => service.updateStation(principal, params.id, body),
    }),
    defineRoute({
      method: 'get', path: '/weather/stations/:id/days', access: 'signed-in', response: stationDaysResponse, params: idParams, query: rangeQuery,
      handler: ({ principal, params, query }) => service.stationDays(principal, params.id, query),
    }),
    defineRoute({
      method: 'get', path: '/weather/stations/:id/revisions', access: 'weather.upload', response: revisionsResponse, params: idParams, query: revisionsQuery,
      handler: ({ params, query }) => service.revisions(params.id, query.date),
    }),
    defineRoute({
      method: 'post', path: '/weather/uploads', access: 'weather.upload', response: uploadDto, query: uploadQuery, body: uploadForm, status: 201,
      before: [dropUntaken, uploadLimit(ctx.config.WEATHER_UPLOAD_MAX_BYTES), upload, checkCsvUpload],
      handler: ({ principal, body, query }, req) => service.acceptFile(principal, req.file, body, query.wait === 'true'),
    }),
    defineRoute({ method: 'get', path: '/weather/uploads', access: 'weather.upload', response: uploadsResponse, handler: () => service.uploads() }),
    defineRoute({
      method: 'get', path: '/weather/uploads/:id', access: 'weather.upload', response: uploadDto, params: idParams,
      handler: ({ params }) => service.upload(params.id),
    }),
    defineRoute({
      method: 'get', path: '/weather/uploads/:id/issues', access: 'weather.upload', response: issuesResponse, params: idParams,
      query: issuesReportQuery,
      handler: ({ params, query }, _req, res) =>
        query.format === 'csv'
          ? service.issuesCsv(params.id, res, { temperature: query.temperature, rain: query.rain })
          : service.issues(params.id, query.offset, query.limit),
    }),
    defineRoute({
      method: 'put', path: '/weather/observations', access: 'weather.upload', response: uploadDto, body: correctionBody,
      handler: ({ principal, body }) => service.correct(principal, body),
    }),
    defineRoute({
      method: 'post', path: '/weather/observations/void', access: 'weather.upload', body: voidDayBody,
      handler: ({ principal, body }) => service.voidDay(principal, body),
    }),
    defineRoute({
      method: 'post', path: '/weather/observations/confirm', access: 'weather.upload', response: confirmResponse, body: confirmBody,
      handler: ({ principal, body }) => service.confirm(principal, body),
    }),
    defineRoute({ method: 'get', path: '/weather/held', access: 'weather.upload', response: heldResponse, handler: () => service.held() }),
    defineRoute({ method: 'get', path: '/weather/conflicts', access: 'weather.upload', response: conflictsResponse, handler: () => service.conflicts() }),
    defineRoute({
      method: 'post', path: '/weather/conflicts/:id/resolve', access: 'weather.upload', response: resolveConflictResponse, params: conflictParams, body: resolveConflictBody,
      handler: ({ principal, params, body }) => service.resolveConflict(principal, params.id, body),
    }),
    defineRoute({
      method: 'post', path: '/weather/feed/pull', access: 'weather.upload', response: feedPullResponse, status: 201,
      handler: async ({ principal }) => service.pulled(await feed.pull(principal.userId)),
    }),
    defineRoute({
      method: 'get', path: '/weather/districts/:id/series', access: 'signed-in', response: districtSeriesResponse, params: idParams, query: rangeQuery,
      handler: ({ principal, params, query }) => service.districtSeries(principal, params.id, query),
    }),
  ];
}
