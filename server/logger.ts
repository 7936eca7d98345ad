import pino from 'pino';
import pretty from 'pino-pretty';

type RequestLog = { req?: { method?: string; url?: string }; res?: { statusCode?: number }; responseTime?: number };

/** One line per log entry for a person at a terminal: a request as "GET /api/foods 200 12 ms", anything else as its message. */
export function readableLine(log: Record<string, unknown>, messageKey: string): string {
  const { req, res, responseTime } = log as RequestLog;
  if (req?.method && res?.statusCode != null) return `${req.method} ${req.url ?? ''} ${res.statusCode} ${responseTime ?? '?'} ms`;
  return String(log[messageKey] ?? '');
}

// Readable lines when a person watches the terminal (npm start); JSON lines when the output goes to a file or collector.
const toTerminal = process.stdout.isTTY && process.env.NODE_ENV !== 'test' && process.env.LOG_FORMAT !== 'json';

// Personal values never reach the logs: e-mails, glucose, carbohydrate and doses in any logged object, and what a
// database error carries about the row (its SQL with inlined values, bind parameters, the "Key (email)=(…)" detail).
// Stacks and messages stay.
const PERSONAL = ['email', 'password', 'passwordHash', 'glucose', 'glucoseMmol', 'carbsGrams', 'units', 'dose', 'displayName', 'body'];
const DB_ERROR = ['sql', 'parameters', 'detail', 'fields', 'values'];

/** What the logger censors (pino redact paths), exported so a test can check it. */
export const REDACT_PATHS = [
  'req.headers.authorization',
  'req.headers.cookie',
  ...PERSONAL.flatMap((k) => [k, `*.${k}`]),
  ...DB_ERROR.flatMap((k) => [`err.${k}`, `err.original.${k}`, `err.parent.${k}`]),
  'err.errors[*].value',
  'err.errors[*].instance',
];

/** One structured logger for the server; quiet in tests unless LOG_LEVEL says otherwise. */
export const logger = pino(
  {
    level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
    redact: REDACT_PATHS,
  },
  toTerminal
    ? pretty({ colorize: true, translateTime: 'SYS:HH:MM:ss', ignore: 'pid,hostname,req,res,responseTime,reqId,url', messageFormat: readableLine, sync: true })
    : undefined,
);
