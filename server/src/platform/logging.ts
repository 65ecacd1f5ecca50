/**
 * Structured request logs with pino. No personal data: no cookies, no
 * authorization headers, no bodies; the signed-in person appears as a numeric id.
 */
import pino from 'pino';
import { pinoHttp } from 'pino-http';
import type { IncomingMessage } from 'node:http';

export function createLogger(level: string) {
  return pino({
    level,
    redact: { paths: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'], remove: true },
  });
}

export function requestLogger(logger: pino.Logger) {
  return pinoHttp({
    logger,
    customProps: (req: IncomingMessage) => {
      const user = (req as IncomingMessage & { user?: { id: number } }).user;
      return user ? { userId: user.id } : {};
    },
    serializers: {
      req: (req: { method: string; url: string; id: unknown }) => ({ id: req.id, method: req.method, url: String(req.url).split('?')[0] }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    autoLogging: { ignore: (req) => (req.url ?? '').startsWith('/assets/') },
  });
}
