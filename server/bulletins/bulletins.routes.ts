import { bulletinPreviewQuery, bulletinQuery, digestPreviewQuery, outboxQuery, subscriptionsBody, unsubscribeParams } from '../../shared/api/bulletins.schema';
import { digestPdfName } from './digest.render';
import type { AppContext } from '../app-context';
import { defineRoute, type RouteDef } from '../http/route';
import { OutboxService } from '../outbox/outbox.service';
import { BulletinsService } from './bulletins.service';
import { SubscriptionsService } from './subscriptions.service';
import { bulletinPreviewResponse, bulletinSendResponse, digestPreviewResponse, outboxResponse, subscriptionsResponse, unsubscribeResponse } from '../../shared/api/bulletins.schema';

/**
 * The preview is served as its own small HTML document for an <iframe>: mail HTML needs inline styles,
 * which the app's own policy forbids, so this answer gets a locked-down policy of its own (no scripts,
 * no requests, sandboxed).
 */
const PREVIEW_CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; frame-ancestors 'self'; sandbox";

/** Bulletin preview and send, subscriptions and one-click unsubscribe, and the mail delivery log. */
export function bulletinsRoutes(ctx: AppContext): RouteDef[] {
  const bulletins = new BulletinsService(ctx);
  const subscriptions = new SubscriptionsService(ctx);
  const outbox = new OutboxService(ctx);
  return [
    defineRoute({
      method: 'get', path: '/bulletins/preview', access: 'bulletins.preview', response: bulletinPreviewResponse, query: bulletinPreviewQuery,
      handler: ({ query }) => bulletins.preview(query.districtId, query.language),
    }),
    defineRoute({
      method: 'get', path: '/bulletins/preview/html', access: 'bulletins.preview', response: 'stream', query: bulletinQuery,
      handler: async ({ query }, _req, res) => {
        const html = await bulletins.previewHtml(query.districtId, query.language);
        res.setHeader('Content-Security-Policy', PREVIEW_CSP);
        res.setHeader('X-Frame-Options', 'SAMEORIGIN');
        res.type('html').send(html);
      },
    }),
    defineRoute({
      method: 'get', path: '/bulletins/preview/pdf', access: 'bulletins.preview', response: 'stream', query: bulletinQuery,
      handler: async ({ query }, _req, res) => {
        const { filename, pdf } = await bulletins.previewPdf(query.districtId, query.language);
        res.type('application/pdf').setHeader('Content-Disposition', `attachment; filename="${filename}"`);
        res.send(pdf);
      },
    }),
    defineRoute({
      // The signed-in person's own weekly digest as it would reach them (nothing is written).
      method: 'get', path: '/bulletins/digest/preview', access: 'signed-in', response: digestPreviewResponse, query: digestPreviewQuery,
      handler: async ({ principal, query }) => {
        const { g, language, v } = await bulletins.previewDigest(principal, query.language);
        return {
          epiYear: g.epiYear, epiWeek: g.epiWeek, language, layout: g.layout, subject: v.subject, text: v.text,
          filename: digestPdfName(g.region, g.epiYear, g.epiWeek), districts: g.followed,
        };
      },
    }),
    defineRoute({
      method: 'get', path: '/bulletins/digest/preview/html', access: 'signed-in', response: 'stream', query: digestPreviewQuery,
      handler: async ({ principal, query }, _req, res) => {
        const { html } = await bulletins.previewDigest(principal, query.language);
        res.setHeader('Content-Security-Policy', PREVIEW_CSP);
        res.setHeader('X-Frame-Options', 'SAMEORIGIN');
        res.type('html').send(html);
      },
    }),
    defineRoute({
      method: 'get', path: '/bulletins/digest/preview/pdf', access: 'signed-in', response: 'stream', query: digestPreviewQuery,
      handler: async ({ principal, query }, _req, res) => {
        const { g, v } = await bulletins.previewDigest(principal, query.language);
        res.type('application/pdf').setHeader('Content-Disposition', `attachment; filename="${digestPdfName(g.region, g.epiYear, g.epiWeek)}"`);
        res.send(v.pdf);
      },
    }),
    defineRoute({
      method: 'post', path: '/bulletins/send', access: 'bulletins.send', response: bulletinSendResponse,
      handler: ({ principal }) => bulletins.sendNow(principal),
    }),
    defineRoute({ method: 'get', path: '/subscriptions/me', access: 'signed-in', response: subscriptionsResponse, handler: ({ principal }) => subscriptions.mine(principal) }),
    defineRoute({
      method: 'put', path: '/subscriptions/me', access: 'signed-in', response: subscriptionsResponse, body: subscriptionsBody,
      handler: ({ principal, body }) => subscriptions.save(principal, body),
    }),
    defineRoute({
      // The confirmation page reads what the link would stop: opening a link (as mail scanners do) changes nothing.
      method: 'get', path: '/unsubscribe/:token', access: 'public', response: unsubscribeResponse, params: unsubscribeParams,
      handler: ({ params }) => subscriptions.describe(params.token),
    }),
    defineRoute({
      // The page's confirm button, and a mail program's one-click POST (RFC 8058, body "List-Unsubscribe=One-Click"), no sign-in.
      method: 'post', path: '/unsubscribe/:token', access: 'public', response: unsubscribeResponse, params: unsubscribeParams,
      handler: ({ params }) => subscriptions.unsubscribe(params.token),
    }),
    defineRoute({
      method: 'post', path: '/unsubscribe/:token/undo', access: 'public', response: unsubscribeResponse, params: unsubscribeParams,
      handler: ({ params }) => subscriptions.undo(params.token),
    }),
    defineRoute({
      method: 'get', path: '/outbox', access: 'outbox.read', response: outboxResponse, query: outboxQuery,
      handler: ({ query }) => outbox.log(query),
    }),
  ];
}
