import pino from 'pino';

/**
 * One logger for the process. Security events use a stable `event` field (login_failed, login_locked,
 * authz_denied, csrf_rejected, rate_limited, upload_rejected…) so they can be searched and alerted on.
 * Passwords, tokens and session ids are never logged; the redact list is a second line of defence.
 */
export function createLogger(level: string) {
  return pino({
    level,
    redact: {
      paths: ['password', '*.password', 'token', '*.token', 'req.headers.cookie', 'req.headers["x-xsrf-token"]', 'res.headers["set-cookie"]'],
      censor: '[redacted]',
    },
  });
}
export type Logger = ReturnType<typeof createLogger>;
