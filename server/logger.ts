import pino from 'pino';

/** One structured JSON logger for the server; quiet in tests unless LOG_LEVEL says otherwise. */
export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
  redact: ['req.headers.authorization', 'req.headers.cookie', '*.password', '*.passwordHash'],
});
