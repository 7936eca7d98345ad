import crypto from 'node:crypto';
import type { Request, Response } from 'express';
import { QueryTypes, UniqueConstraintError, type Sequelize } from 'sequelize';
import { AppError } from '../errors';

/** The request header a client sends with a create it may retry. */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
/** How long an answer is kept for replay. */
export const IDEMPOTENCY_KEEP_HOURS = 24;

const KEY_PATTERN = /^[\x21-\x7e]{1,200}$/;

type Stored = { request_hash: string; status: number; body: unknown };
type Scope = { sequelize: Sequelize; userId: number; route: string; key: string; hash: string };

/** A hash of what a request asks for (its parsed parts and any uploaded file), to tell a retry from a different request. */
export function requestHash(parts: unknown, file?: Buffer): string {
  const hash = crypto.createHash('sha256').update(JSON.stringify(parts ?? null));
  if (file) hash.update(file);
  return hash.digest('hex');
}

async function findAnswer({ sequelize, userId, route, key }: Scope): Promise<Stored | undefined> {
  const rows = await sequelize.query<Stored>(
    `SELECT request_hash, status, body FROM idempotency_keys
      WHERE user_id = :userId AND route = :route AND key = :key AND created_at > now() - interval '${IDEMPOTENCY_KEEP_HOURS} hours'`,
    { replacements: { userId, route, key }, type: QueryTypes.SELECT },
  );
  return rows[0];
}

function replay(res: Response, stored: Stored, scope: Scope): void {
  if (stored.request_hash !== scope.hash) {
    throw AppError.unprocessable('This Idempotency-Key was already used for a different request. Send a new key with a new request.', {
      [IDEMPOTENCY_HEADER]: ['Already used for a different request.'],
    });
  }
  res.set('Idempotent-Replayed', 'true');
  res.status(stored.status).json(stored.body);
}

/**
 * Runs a create once per user, route and `Idempotency-Key`: the handler and the stored answer share one transaction
 * (services' own transactions join it as savepoints), so either both are saved or neither. The same key again gets
 * the same answer without a second row; the same key with a different request gets 422. Without the header the
 * handler just runs.
 */
export async function runIdempotent(
  req: Request,
  res: Response,
  ctx: { sequelize: Sequelize; userId: number; route: string; hash: string },
  handler: () => unknown,
): Promise<void> {
  const key = req.get(IDEMPOTENCY_HEADER);
  if (key === undefined) {
    await handler();
    return;
  }
  if (!KEY_PATTERN.test(key)) {
    throw AppError.validation({ [IDEMPOTENCY_HEADER]: ['Use 1 to 200 printable characters without spaces (a random UUID is ideal).'] });
  }
  const scope: Scope = { ...ctx, key };
  const earlier = await findAnswer(scope);
  if (earlier) return replay(res, earlier, scope);

  const send = res.json.bind(res);
  let answer: { status: number; body: unknown } | undefined;
  res.json = ((body: unknown) => {
    answer = { status: res.statusCode, body };
    return res;
  }) as Response['json'];
  try {
    await ctx.sequelize.transaction(async (transaction) => {
      await handler();
      if (!answer) throw new Error('a create that accepts Idempotency-Key must answer with JSON');
      if (answer.status < 200 || answer.status > 299) return;
      const replacements = { ...scope, status: answer.status, body: JSON.stringify(answer.body) };
      await ctx.sequelize.query(
        `DELETE FROM idempotency_keys WHERE user_id = :userId AND created_at < now() - interval '${IDEMPOTENCY_KEEP_HOURS} hours'`,
        { replacements, transaction },
      );
      await ctx.sequelize.query(
        `INSERT INTO idempotency_keys (user_id, route, key, request_hash, status, body, created_at)
         VALUES (:userId, :route, :key, :hash, :status, CAST(:body AS jsonb), now())`,
        { replacements, transaction },
      );
    });
  } catch (err) {
    res.json = send;
    // The same key sent twice at once: the first to commit wins, the other's work was rolled back; answer as the first.
    const winner = err instanceof UniqueConstraintError ? await findAnswer(scope) : undefined;
    if (winner) return replay(res, winner, scope);
    throw err;
  }
  res.json = send;
  res.status(answer!.status).json(answer!.body);
}
