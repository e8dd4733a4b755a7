import type { Request, RequestHandler, Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { tooManyRequests } from './errors.ts';

export interface LimitOptions {
  /** A short name, unique per limiter (the request property that holds its state). */
  name: string;
  windowMs: number;
  limit: number;
  /** What is counted against: a client address, an e-mail, a department… (several parts are joined). */
  key: (req: Request, res: Response) => string;
  /** The refusal's text, given the minutes until the window resets. */
  message: (minutes: number) => string;
  /** Count only refused attempts (failed sign-ins), not successful ones. */
  countFailuresOnly?: boolean;
}

/** The client address as a limiter key (IPv6 addresses grouped by /56, as express-rate-limit advises). */
export const clientKey = (req: Request) => ipKeyGenerator(req.ip ?? '');

/** The e-mail field of a JSON body, normalised, as a limiter key. */
export const bodyEmailKey = (req: Request) => String((req.body as { email?: unknown } | undefined)?.email ?? '').trim().toLowerCase();

/**
 * The one rate limiter of the API (express-rate-limit, in memory): over `limit` requests per
 * key in the window are refused with 429, the JSON error shape and Retry-After.
 */
export function limiter(options: LimitOptions): RequestHandler {
  const property = `rateLimit_${options.name}`;
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    skipSuccessfulRequests: options.countFailuresOnly ?? false,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    requestPropertyName: property,
    keyGenerator: options.key,
    handler: (req, _res, next) => {
      const resetTime = (req as unknown as Record<string, { resetTime?: Date } | undefined>)[property]?.resetTime;
      const seconds = Math.max(1, Math.ceil(((resetTime?.getTime() ?? Date.now() + options.windowMs) - Date.now()) / 1000));
      next(tooManyRequests(options.message(Math.ceil(seconds / 60)), seconds));
    },
  });
}

export const minutesText = (minutes: number) => `${minutes} minute${minutes === 1 ? '' : 's'}`;
