import pino, { type Logger } from 'pino';

/** JSON logs to stdout; secrets and cookies are redacted. */
export function createLogger(level: string): Logger {
  return pino({
    level,
    redact: {
      paths: ['req.headers.cookie', 'req.headers.authorization', 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]'],
      censor: '[redacted]',
    },
  });
}
