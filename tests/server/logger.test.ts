import { readableLine } from '../../server/logger';

// The terminal line for each kind of entry; the fields are the ones pino-http writes (req, res, responseTime).
const cases = [
  {
    name: 'a request as method, path, status and time',
    log: { msg: 'request completed', req: { method: 'GET', url: '/api/foods' }, res: { statusCode: 200 }, responseTime: 12 },
    line: 'GET /api/foods 200 12 ms',
  },
  {
    name: 'a failed request with its status',
    log: { msg: 'request errored', req: { method: 'POST', url: '/api/recipes' }, res: { statusCode: 500 }, responseTime: 3 },
    line: 'POST /api/recipes 500 3 ms',
  },
  { name: 'any other entry as its message', log: { msg: 'Carbwright is listening', url: 'http://127.0.0.1:8080' }, line: 'Carbwright is listening' },
];

describe('readableLine', () => {
  it.each(cases)('$name', ({ log, line }) => {
    expect(readableLine(log, 'msg')).toBe(line);
  });
});
