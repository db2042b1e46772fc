// Structured logs. Secrets never reach them: cookies, auth headers, passwords and tokens are redacted,
// request bodies are not logged, and query strings are dropped from logged URLs.
import pino, { type DestinationStream } from 'pino';

export function createLogger(level: string, destination?: DestinationStream) {
  return pino(
    {
      level,
      redact: {
        paths: [
          'req.headers.cookie',
          'req.headers.authorization',
          'res.headers["set-cookie"]',
          '*.password',
          '*.token',
          '*.passwordHash',
        ],
        censor: '[redacted]',
      },
    },
    destination,
  );
}

export type Logger = ReturnType<typeof createLogger>;
