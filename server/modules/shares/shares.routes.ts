import { Router, type Request, type Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { idParamsSchema } from '../../../shared/contracts/common.ts';
import { exportListingSchema, exportQuerySchema } from '../../../shared/contracts/exports.ts';
import { createShareResponseSchema, shareLinkListSchema, sharedObjectSchema, shareTokenParamsSchema } from '../../../shared/contracts/shares.ts';
import type { Config } from '../../config.ts';
import { tooManyRequests } from '../../lib/errors.ts';
import { defineRoute, type RouteRegistry } from '../../lib/http.ts';
import { sendExport } from '../exports/exports.routes.ts';
import { sendDownload } from '../../lib/csv.ts';
import type { SharesService } from './shares.service.ts';

function limiter(windowMs: number, limit: number, key: (req: Request, res: Response) => string, what: string) {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: key,
    handler: (req, _res, next) => {
      const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = Math.max(1, Math.ceil(((resetTime?.getTime() ?? Date.now() + windowMs) - Date.now()) / 1000));
      next(tooManyRequests(`Too many ${what}. Try again in ${seconds} second${seconds === 1 ? '' : 's'}.`, seconds));
    },
  });
}

/** The address the caller reached this server at (used for links when PUBLIC_URL is not set). */
const requestBase = (req: Request) => `${req.protocol}://${req.get('host')}`;

/**
 * Read-only share links: members create them for a run or sweep, the department lists and
 * revokes them, and anyone holding the secret URL reads exactly that object.
 */
export function sharesRoutes(registry: RouteRegistry, config: Config, shares: SharesService): Router {
  const router = Router();
  const mount = '/api';
  const tag = 'Share links';
  // Per member (creation) and per client address (public reads).
  const creating = limiter(3_600_000, config.SHARE_LINKS_PER_HOUR, (_req, res) => `share:${res.locals.auth?.user.id ?? ''}`, 'share links created in the last hour');
  const reading = limiter(60_000, config.SHARED_READS_PER_MINUTE, (req) => `shared:${ipKeyGenerator(req.ip ?? '')}`, 'requests for shared links from this address');

  defineRoute(router, registry, mount, {
    method: 'post', path: '/runs/:id/share', tag, access: 'modeller', status: 201, params: idParamsSchema, response: createShareResponseSchema, before: [creating],
    summary: 'Create a read-only link to a finished run (the URL holds a secret and is shown once)',
  }, ({ auth, params, req }) => shares.createForRun(auth, params.id, requestBase(req)));

  defineRoute(router, registry, mount, {
    method: 'post', path: '/sweeps/:id/share', tag, access: 'modeller', status: 201, params: idParamsSchema, response: createShareResponseSchema, before: [creating],
    summary: 'Create a read-only link to a sweep (the URL holds a secret and is shown once)',
  }, ({ auth, params, req }) => shares.createForSweep(auth, params.id, requestBase(req)));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/share-links', tag, access: 'observer', response: shareLinkListSchema,
    summary: "The department's share links, revoked ones included (never the secret)",
  }, async ({ auth }) => ({ links: await shares.list(auth) }));

  defineRoute(router, registry, mount, {
    method: 'delete', path: '/share-links/:id', tag, access: 'modeller', status: 204, params: idParamsSchema,
    summary: 'Revoke a share link: it answers 404 from then on',
  }, async ({ auth, params }) => {
    await shares.revoke(auth, params.id);
  });

  defineRoute(router, registry, mount, {
    method: 'get', path: '/shared/:token', tag, access: 'public', params: shareTokenParamsSchema, response: sharedObjectSchema, before: [reading],
    summary: 'The shared run (result, methods paragraph) or sweep (its points), read-only, without signing in',
  }, ({ params }) => shares.open(params.token));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/shared/:token/export', tag, access: 'public', params: shareTokenParamsSchema, query: exportQuerySchema, response: exportListingSchema,
    produces: 'text/x-ecsv', before: [reading], summary: "The shared object's tables as ECSV or VOTable (as /runs/{id}/export)",
  }, async ({ params, query, res }) => sendExport(res, await shares.exportOf(params.token, query)));

  defineRoute(router, registry, mount, {
    method: 'get', path: '/shared/:token/references.bib', tag, access: 'public', params: shareTokenParamsSchema, produces: 'application/x-bibtex', before: [reading],
    summary: "The shared run's references as BibTeX",
  }, async ({ params, res }) => {
    const file = await shares.referencesOf(params.token);
    sendDownload(res, file.filename, file.body, file.contentType);
  });

  return router;
}
