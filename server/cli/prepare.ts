/**
 * npm start's preparation alone (migrate, admin, default food tables, demo), then exit: run once per release before
 * starting API copies with server/cli/serve.ts. Idempotent.
 */
import { prepare } from './setup';

prepare()
  .then(() => process.exit(0))
  .catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
