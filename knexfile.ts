import { buildKnexConfig } from "./db/config";

// Used by the knex CLI (run through tsx: see the db:* scripts in package.json).
export default buildKnexConfig();
