// For anyone reaching for the knex CLI: the connection `npm start` uses. Wardbook's own
// commands are `npm run db:migrate`, `db:rollback` and `db:make` (server/cli/db.ts), which load
// TypeScript migrations through server/db/migrate.ts.
import { loadConfig } from './server/config/config';
import { knexConfig } from './server/db/knex';

const { postgres } = loadConfig();

export default knexConfig(postgres);
